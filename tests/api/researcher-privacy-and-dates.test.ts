import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import type { CompareResponse } from '@/lib/data/compare';
import type { LoadedRun } from '@/lib/data/run-report';
import type { RunFilterOptions } from '@/lib/data/runs';
import type { AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { DEMO_ACCOUNTS, signInAs, type HttpSession } from '../support/http-session';

// Issue 13 (low findings): researchers saw free text with real names and user ids; impossible
// dates were ignored or matched nothing; the research export's key travelled in the URL.
let server: AppServer;
let researcher: HttpSession;
let instructor: HttpSession;
let runId: number;
let operator: { id: number; name: string };
let savedNotes: string | null;
const COMMENT_TAG = `itest-privacy-${Date.now()}`;

beforeAll(async () => {
  server = sharedAppServer();
  researcher = await signInAs(server.baseUrl, DEMO_ACCOUNTS.researcher);
  instructor = await signInAs(server.baseUrl, DEMO_ACCOUNTS.instructor);
  const [row] = await sequelize.query<{ id: number; operator_id: number; name: string; notes: string | null; instructor_id: number }>(
    `SELECT r.id, r.operator_id, u.name, r.notes, c.instructor_id FROM runs r JOIN users u ON u.id = r.operator_id JOIN cohorts c ON c.id = r.cohort_id
      WHERE r.status = 'complete' ORDER BY r.id LIMIT 1`,
    { type: QueryTypes.SELECT },
  );
  runId = Number(row!.id);
  operator = { id: Number(row!.operator_id), name: row!.name };
  savedNotes = row!.notes;
  // Free text that names the trainee, as instructors write it.
  await sequelize.query('UPDATE runs SET notes = ? WHERE id = ?', { replacements: [`Retorqued by ${operator.name} after lunch`, runId] });
  await sequelize.query('INSERT INTO run_comments (run_id, author_id, body, created_at) VALUES (?, ?, ?, NOW())', { replacements: [runId, row!.instructor_id, `${COMMENT_TAG}: ${operator.name}, watch stud 3`] });
});

afterAll(async () => {
  await sequelize.query('UPDATE runs SET notes = ? WHERE id = ?', { replacements: [savedNotes, runId] });
  await sequelize.query('DELETE FROM run_comments WHERE body LIKE ?', { replacements: [`${COMMENT_TAG}%`] });
  await sequelize.close();
});

describe('what a researcher receives', () => {
  it('GET /api/runs/:id gives no free text and no user id', async () => {
    const response = await researcher.get(`/api/runs/${runId}`);
    expect(response.status).toBe(200);
    const text = await response.text();
    expect(text).not.toContain(operator.name);
    const body = JSON.parse(text) as LoadedRun;
    expect(body.header.notes).toBeNull();
    expect(body.comments).toEqual([]);
    expect(body.header.operator).not.toHaveProperty('id');
    expect(body.header.operator.key).not.toBe(String(operator.id));
    expect(body.header.operator.key).toMatch(/^op-[A-Z2-9]{6}$/);
    // The instructor who teaches the cohort still reads both.
    const own = (await (await instructor.get(`/api/runs/${runId}`)).json()) as LoadedRun;
    expect(own.header.notes).toContain(operator.name);
    expect(own.comments.some((c) => c.body.startsWith(COMMENT_TAG))).toBe(true);
  });

  it('the run report page shows neither the notes nor the comment', async () => {
    const response = await researcher.get(`/runs/${runId}`);
    expect(response.status).toBe(200);
    const html = await response.text();
    expect(html).not.toContain(operator.name);
    expect(html).not.toContain(COMMENT_TAG);
  });

  it('comparison group keys by operator are pseudonym codes, and choosing operators by id is refused', async () => {
    const response = await researcher.get('/api/compare?by=trainee');
    expect(response.status).toBe(200);
    const body = (await response.json()) as CompareResponse;
    const userIds = (await sequelize.query<{ id: number }>('SELECT id FROM users', { type: QueryTypes.SELECT })).map((u) => String(u.id));
    expect(body.groups.length).toBeGreaterThan(1);
    for (const group of body.groups) {
      expect(userIds).not.toContain(group.key);
      expect(group.key).toMatch(/^op-[A-Z2-9]{6}$/);
    }
    expect((await researcher.get(`/api/compare?by=trainee&ids=${operator.id}`)).status).toBe(422);
  });

  it('the runs filters offer no user ids and refuse an operator id', async () => {
    const options = (await (await researcher.get('/api/runs/options')).json()) as RunFilterOptions;
    expect(options.operators).toEqual([]);
    expect((await researcher.get(`/api/runs?operatorId=${operator.id}`)).status).toBe(422);
    expect((await researcher.get(`/api/runs/export?format=csv&operatorId=${operator.id}`)).status).toBe(422);
  });

  it('the selection export names no one', async () => {
    const response = await researcher.get(`/api/runs/export?format=json&cohortId=${(await cohortOf(runId))}`);
    expect(response.status).toBe(200);
    expect(await response.text()).not.toContain(operator.name);
  });
});

async function cohortOf(id: number): Promise<number> {
  const [row] = await sequelize.query<{ cohort_id: number }>('SELECT cohort_id FROM runs WHERE id = ?', { type: QueryTypes.SELECT, replacements: [id] });
  return Number(row!.cohort_id);
}

describe('dates are real dates', () => {
  const bad = ['from=9999-99-99', 'to=2026-02-30'];
  for (const query of bad) {
    it(`answers 422 to ${query} on the runs list, the selection export, the comparison and the research export`, async () => {
      for (const path of [`/api/runs?${query}`, `/api/runs/export?format=csv&${query}`, `/api/compare?by=method&${query}`]) {
        const response = await researcher.get(path);
        expect(response.status, path).toBe(422);
        expect(((await response.json()) as { error: { message: string } }).error.message, path).toContain('real date');
      }
      const [name, value] = query.split('=');
      const research = await researcher.send('POST', '/api/exports/runs.csv', { key: 'privacy-test-key', [name!]: value });
      expect(research.status).toBe(422);
    });
  }
});

describe('the research export key', () => {
  it('travels in the POST body; a key in the address is not served', async () => {
    const posted = await researcher.send('POST', '/api/exports/runs.csv', { key: 'privacy-test-key', from: '2026-01-01', to: '2026-12-31' });
    expect(posted.status).toBe(200);
    expect((await posted.text()).split('\r\n')[0]).toBe('run_id,recorded_at,joint,method,lubricant,cohort,operator,step,pass,tightened_position,position,load_n');
    // A browser form posts the same fields urlencoded.
    const form = await researcher.send('POST', '/api/exports/runs.csv', 'key=privacy-test-key&cohortId=', { 'content-type': 'application/x-www-form-urlencoded' });
    expect(form.status).toBe(200);
    expect((await researcher.get('/api/exports/runs.csv?key=privacy-test-key')).status).toBe(405);
    expect((await researcher.send('POST', '/api/exports/runs.csv?key=privacy-test-key', {})).status).toBe(422);
  });
});
