import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import type { AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { anonymous, DEMO_ACCOUNTS, signInAs, type HttpSession } from '../support/http-session';
import { BAD_INPUTS, type Caller } from './bad-inputs';

// Every bad input gets a 4xx with a sentence saying what was wrong, and changes nothing: the row
// counts of every table are the same before and after the whole corpus.
let server: AppServer;
const sessions = {} as Record<Caller, HttpSession>;
const placeholders: Record<string, string> = {};
let before: Record<string, number>;

async function rowCounts(): Promise<Record<string, number>> {
  const tables = (await sequelize.query<Record<string, string>>('SHOW TABLES', { type: QueryTypes.SELECT }))
    .map((row) => Object.values(row)[0] as string)
    .filter((t) => !['sign_in_attempts', 'comparison_cache', 'schema_migrations', 'schema_seeds'].includes(t));
  const counts: Record<string, number> = {};
  for (const table of tables) {
    const [row] = await sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM \`${table}\``, { type: QueryTypes.SELECT });
    counts[table] = Number(row!.n);
  }
  return counts;
}

beforeAll(async () => {
  server = sharedAppServer();
  sessions.anonymous = anonymous(server.baseUrl);
  for (const role of ['admin', 'instructor', 'researcher', 'trainee'] as const) sessions[role] = await signInAs(server.baseUrl, DEMO_ACCOUNTS[role]);
  const [other] = await sequelize.query<{ id: number }>(
    "SELECT r.id FROM runs r JOIN users o ON o.id = r.operator_id WHERE o.role = 'trainee' AND o.email <> ? ORDER BY r.id LIMIT 1",
    { type: QueryTypes.SELECT, replacements: [DEMO_ACCOUNTS.trainee] },
  );
  placeholders.othersRun = String(other!.id);
  before = await rowCounts();
});

afterAll(async () => {
  await sequelize.close();
});

describe(`bad-input corpus (${BAD_INPUTS.length} cases)`, () => {
  it('has at least 40 cases', () => {
    expect(BAD_INPUTS.length).toBeGreaterThanOrEqual(40);
  });

  for (const entry of BAD_INPUTS) {
    it(`${entry.name}: ${entry.method} ${entry.path.slice(0, 80)} as ${entry.as} gets ${entry.status}`, async () => {
      const path = entry.path.replace(/\{(\w+)\}/g, (_, key: string) => placeholders[key] ?? '');
      const response = await sessions[entry.as].send(entry.method, path, entry.body, entry.headers);
      expect(response.status).toBe(entry.status);
      if (entry.status !== 405) {
        const body = (await response.json()) as { error?: { message?: string } };
        expect(body.error?.message).toMatch(entry.message ?? /\w+ \w+/);
        expect(body.error?.message ?? '').not.toMatch(/<script|SELECT |stack|at Object\./i);
      }
    });
  }

  it('changed no row in any table', async () => {
    expect(await rowCounts()).toEqual(before);
  });
});
