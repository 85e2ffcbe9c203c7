/**
 * Connect logger on Record → Stream live, in Chromium against the built app. The real Web Serial API
 * needs a person to pick a port, so a stand-in for `navigator.serial` (page.addInitScript) plays
 * recorded lines: an invented tightening made by tests/support/serial-lines.ts in the joint's own
 * line format (semicolon-delimited, decimal commas, kN, channels placed by the joint's channel map),
 * delivered in odd-sized chunks with CRLF line ends and one malformed line, after which the device
 * is lost. The test checks the readings reached the server, the page says the logger was
 * disconnected and what was kept, the malformed line is counted, and Finish stores the run with the
 * final loads of the last line played. Without `navigator.serial` the panel shows the bridge path.
 */
import { QueryTypes } from 'sequelize';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import type { AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { launchBrowser, screenshotPath, signedInPage } from '../support/browser';
import { createTestJoint, createTestMethod, CROSS_4, dropTestJoints, dropTestMethods } from '../support/record-fixtures';
import { tighteningLines } from '../support/serial-lines';

let server: AppServer;
let browser: Browser;
let jointId: number;
let jointName: string;
let methodId: number;

/** The joint's channel map in this test: CH1 is wired to stud 3 and CH3 to stud 1 (CH2, CH4 default to studs 2 and 4). */
const CHANNEL_OF_POSITION: Record<number, number> = { 1: 3, 2: 2, 3: 1, 4: 4 };
const BAUD = 19200;

/** Invented loads: pass 1 to 40 kN, pass 2 to about the 80 kN target (inside the ±10 % band of the test joint). */
const LINES = tighteningLines({
  order: CROSS_4,
  passesKn: [[40, 40, 40, 40], [78.5, 79.9, 81.2, 80.6]],
  channelOfPosition: (p) => CHANNEL_OF_POSITION[p]!,
  delimiter: ';',
  decimalComma: true,
});
const MALFORMED = '1,45;40,00;oops;0,00;0,00';
/** What the port plays: a header, the lines with one malformed line among them, CRLF line ends. */
const PLAYED = ['time;CH1;CH2;CH3;CH4', ...LINES.slice(0, 20), MALFORMED, ...LINES.slice(20)].join('\r\n') + '\r\n';

/**
 * The expectation, worked out from the lines played (not through the app's parser): the last line's
 * channel fields, decimal comma read as a point, kN × 1000 = N, each channel put on its stud.
 */
function expectedFinalLoadsN(): number[] {
  const fields = LINES[LINES.length - 1]!.split(';').slice(1).map((f) => Number(f.replace(',', '.')) * 1000);
  return [1, 2, 3, 4].map((position) => fields[CHANNEL_OF_POSITION[position]! - 1]!);
}

beforeAll(async () => {
  server = sharedAppServer();
  jointId = await createTestJoint(4, 'serial');
  await sequelize.query("UPDATE joints SET serial_baud_rate = ?, line_delimiter = 'semicolon', line_decimal_comma = 1, line_load_unit = 'kN' WHERE id = ?", { replacements: [BAUD, jointId] });
  await sequelize.query("UPDATE joint_positions SET channel = CASE position WHEN 1 THEN 'CH3' WHEN 3 THEN 'CH1' END WHERE joint_id = ? AND position IN (1, 3)", { replacements: [jointId] });
  const [row] = await sequelize.query<{ name: string }>('SELECT name FROM joints WHERE id = ?', { type: QueryTypes.SELECT, replacements: [jointId] });
  jointName = row!.name;
  methodId = await createTestMethod('Two cross passes 50/100 % (4 studs, serial e2e)', [50, 100]);
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await dropTestJoints([jointId]);
  await dropTestMethods([methodId]);
  await sequelize.close();
});

/** Record → Stream live on the test joint and method; starts a recording and returns its run id. */
async function startRecording(page: Page): Promise<number> {
  await page.goto(`${server.baseUrl}/record`);
  await page.getByLabel('Joint', { exact: true }).selectOption({ label: `${jointName} (4 studs)` });
  await page.getByLabel('Method', { exact: true }).selectOption(String(methodId));
  await page.getByRole('tab', { name: 'Stream live' }).click();
  await page.getByRole('button', { name: 'Start recording' }).click();
  const started = await page.getByText(/^Recording run \d+\./).textContent({ timeout: 20_000 });
  return Number(/run (\d+)/.exec(started!)![1]);
}

/**
 * Stands in for `navigator.serial`: the k-th opening of the port plays `texts[k]` in 37-byte chunks,
 * then the device is lost (as a cable pulled out). Records the baud rate of each opening.
 */
async function playSerialPort(page: Page, texts: string[]) {
  await page.addInitScript(({ texts, chunk }) => {
    const opened: number[] = [];
    (window as unknown as { __serialOpened: number[] }).__serialOpened = opened;
    const port = {
      readable: null as ReadableStream<Uint8Array> | null,
      async open({ baudRate }: { baudRate: number }) {
        const bytes = new TextEncoder().encode(texts[opened.length] ?? '');
        opened.push(baudRate);
        let offset = 0;
        port.readable = new ReadableStream<Uint8Array>({
          async pull(controller) {
            await new Promise((resolve) => setTimeout(resolve, 10));
            if (offset >= bytes.length) {
              port.readable = null;
              controller.error(new DOMException('The device has been lost.', 'NetworkError'));
              return;
            }
            controller.enqueue(bytes.slice(offset, offset + chunk));
            offset += chunk;
          },
        });
      },
      async close() {},
    };
    Object.defineProperty(Navigator.prototype, 'serial', { configurable: true, get: () => ({ requestPort: async () => port, addEventListener() {} }) });
  }, { texts, chunk: 37 });
}

describe('Connect logger (Web Serial) on Stream live', () => {
  it('reads the played lines in the joint format, sends them, survives a lost device and stores the final loads', async () => {
    const page = await signedInPage(browser, server.baseUrl, 'instructor', { viewport: { width: 1280, height: 1000 } });
    await playSerialPort(page, [PLAYED]);

    const runId = await startRecording(page);
    await page.getByRole('button', { name: 'Connect logger' }).click();
    await page.getByText(/^The logger was disconnected mid-run \(The device has been lost\)\. The \d+ readings sent before are kept in run \d+/).waitFor({ timeout: 30_000 });

    // Every good line gives one reading per stud; the header is skipped and the malformed line counted.
    const readings = LINES.length * 4;
    expect(await page.getByTestId('serial-phase').textContent()).toContain(`The ${readings} readings sent before are kept in run ${runId}`);
    await expect.poll(() => page.getByTestId('serial-counts').textContent()).toMatch(new RegExp(`^${readings} readings sent · 1 malformed line skipped$`));
    await page.getByText(/Line 22, column "field 3": "oops" is not a number/).waitFor();
    expect(await page.evaluate(() => (window as unknown as { __serialOpened: number[] }).__serialOpened)).toEqual([BAUD]);
    const [count] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM stream_samples WHERE run_id = ?', { type: QueryTypes.SELECT, replacements: [runId] });
    expect(Number(count!.n)).toBe(readings);
    await page.waitForFunction((n) => Number(document.querySelector('[data-testid=sample-count]')?.textContent ?? '0') === n, readings, { timeout: 20_000 });
    await page.getByTestId('live-band').waitFor();
    // Numbers and units are joined by narrow no-break spaces on screen: compare with plain spaces.
    expect((await page.getByTestId('live-band').textContent())!.replace(/\s+/g, ' ')).toMatch(/band ±10\.0 %: 72\.0 kN to 88\.0 kN · 4 of 4 studs in the band/);
    await page.screenshot({ path: screenshotPath('record-serial-logger'), fullPage: true });

    await page.getByRole('button', { name: 'Finish' }).click();
    // Two cross passes 1-3-2-4 as the test method prescribes: 8 steps, the run check passes it.
    await page.getByText(new RegExp(`^Run ${runId} is complete: 8 steps derived from the stream\\. Open run ${runId}$`)).waitFor({ timeout: 20_000 });
    const finals = await sequelize.query<{ position: number; load_n: number }>(
      `SELECT r.position, r.load_n FROM readings r JOIN tightening_steps s ON s.id = r.step_id
       WHERE s.run_id = ? AND s.step_order = (SELECT MAX(step_order) FROM tightening_steps WHERE run_id = ?) ORDER BY r.position`,
      { type: QueryTypes.SELECT, replacements: [runId, runId] },
    );
    // Expected: the last line's channels CH1..CH4 = 81.2, 79.9, 78.5, 80.6 kN placed on studs 3, 2, 1, 4:
    // studs 1..4 = 78 500, 79 900, 81 200, 80 600 N.
    const expected = expectedFinalLoadsN();
    expect(expected).toEqual([78_500, 79_900, 81_200, 80_600]);
    expect(finals.map((f) => Number(f.position))).toEqual([1, 2, 3, 4]);
    finals.forEach((f, i) => expect(Number(f.load_n)).toBeCloseTo(expected[i]!, 6));
    await page.context().close();
  });

  it('continues after the last stored reading when the logger comes back with its clock restarted, and says so', async () => {
    const page = await signedInPage(browser, server.baseUrl, 'instructor', { viewport: { width: 1280, height: 1000 } });
    // Invented lines in the joint's format: 0, 0,5 and 1 s, twice: the logger restarts its clock after the lost connection.
    const lines = ['0;10,0;10,0;10,0;10,0', '0,5;20,0;20,0;20,0;20,0', '1;30,0;30,0;30,0;30,0'].join('\r\n') + '\r\n';
    await playSerialPort(page, [lines, lines]);
    const runId = await startRecording(page);
    const lost = /^The logger was disconnected mid-run/;
    await page.getByRole('button', { name: 'Connect logger' }).click();
    await page.getByText(lost).waitFor({ timeout: 30_000 });
    await page.getByRole('button', { name: 'Connect logger' }).click();
    // Expected from the rule in lib/ingest/logger-clock.ts: last stored 1 s + 1 s (spacing not yet known) = 2 s.
    await page.getByTestId('serial-clock-restart').waitFor({ timeout: 30_000 });
    expect(await page.getByTestId('serial-clock-restart').textContent()).toBe('The logger’s clock restarted (it sent 0 s after later times); its readings continue after the last one, from 2 s in this run. Nothing stored was replaced.');
    await page.getByText(lost).waitFor({ timeout: 30_000 });
    const samples = await sequelize.query<{ t: number; n: number }>('SELECT time_s AS t, COUNT(*) AS n FROM stream_samples WHERE run_id = ? GROUP BY time_s ORDER BY time_s', { type: QueryTypes.SELECT, replacements: [runId] });
    // Six moments of four studs each, none replaced: 0, 0.5, 1, then 2, 2.5, 3 s.
    expect(samples.map((s) => [Number(s.t), Number(s.n)])).toEqual([[0, 4], [0.5, 4], [1, 4], [2, 4], [2.5, 4], [3, 4]]);
    await page.context().close();
  });

  it('shows the bridge path, step by step with the run in the command, when the browser has no navigator.serial', async () => {
    const page = await signedInPage(browser, server.baseUrl, 'instructor', { viewport: { width: 1280, height: 1000 } });
    await page.addInitScript(() => {
      delete (Navigator.prototype as { serial?: unknown }).serial;
      if ('serial' in navigator) Object.defineProperty(Navigator.prototype, 'serial', { configurable: true, get: () => undefined });
    });
    const runId = await startRecording(page);
    await page.getByTestId('serial-unavailable').waitFor({ timeout: 20_000 });
    expect(await page.getByRole('button', { name: 'Connect logger' }).count()).toBe(0);
    expect(await page.getByTestId('serial-unavailable').textContent()).toContain('This browser cannot connect to a logger itself');
    expect(await page.getByTestId('bridge-command').textContent()).toBe(`npx tsx scripts/stream-bridge.ts --url ${server.baseUrl} --run ${runId} --token <token> --file lines.txt`);
    expect(await page.getByTestId('bridge-steps').textContent()).toMatch(/fields separated by semicolons, decimal comma, time in seconds in field 1, channels 1 to 4 in the fields after it, loads in kN/);
    await page.context().close();
  });
});
