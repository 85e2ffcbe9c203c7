import { readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import type { AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { anonymous, DEMO_ACCOUNTS, signInAs, type HttpSession } from '../support/http-session';
import { EXEMPT_ROUTES, ROUTE_MATRIX, type Caller } from './route-matrix';

const apiRoot = path.resolve(__dirname, '../../app/api');

function routeFiles(dir: string, prefix = '/api'): string[] {
  const found: string[] = [];
  for (const name of readdirSync(dir)) {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) found.push(...routeFiles(full, `${prefix}/${name}`));
    else if (name === 'route.ts') found.push(prefix);
  }
  return found;
}

let server: AppServer;
const sessions = {} as Record<Caller, HttpSession>;
/** Values for the {placeholders} in matrix paths, looked up in the test database. */
const placeholders: Record<string, string> = {};

const resolvePath = (template: string) => template.replace(/\{(\w+)\}/g, (_, name: string) => placeholders[name] ?? `{${name}}`);

beforeAll(async () => {
  server = sharedAppServer();
  // A run of a trainee (not the demo trainee) in a cohort the demo instructor teaches.
  const [run] = await sequelize.query<{ id: number }>(
    `SELECT r.id FROM runs r JOIN cohorts c ON c.id = r.cohort_id JOIN users i ON i.id = c.instructor_id
     JOIN users o ON o.id = r.operator_id WHERE i.email = ? AND o.email <> ? AND o.role = 'trainee' ORDER BY r.id LIMIT 1`,
    { type: QueryTypes.SELECT, replacements: [DEMO_ACCOUNTS.instructor, DEMO_ACCOUNTS.trainee] },
  );
  placeholders.springRun = String(run!.id);
  sessions.anonymous = anonymous(server.baseUrl);
  for (const role of ['admin', 'instructor', 'researcher', 'trainee'] as const) {
    sessions[role] = await signInAs(server.baseUrl, DEMO_ACCOUNTS[role]);
  }
});

afterAll(async () => {
  await sequelize.close();
});

describe('role matrix', () => {
  it('has an entry for every route handler under app/api', () => {
    const covered = new Set([...ROUTE_MATRIX.map((entry) => entry.route), ...EXEMPT_ROUTES]);
    const missing = routeFiles(apiRoot).filter((route) => !covered.has(route));
    expect(missing, `routes without a role-matrix entry: ${missing.join(', ')}`).toEqual([]);
  });

  const callers: Caller[] = ['anonymous', 'admin', 'instructor', 'researcher', 'trainee'];
  for (const entry of ROUTE_MATRIX) {
    for (const caller of callers) {
      it(`${entry.method} ${entry.path} answers ${entry.expect[caller]} to ${caller}`, async () => {
        const response = await sessions[caller].send(entry.method, resolvePath(entry.path), entry.body);
        expect(response.status).toBe(entry.expect[caller]);
        if (response.status >= 400) {
          const body = (await response.json()) as { error?: { message?: string } };
          expect(body.error?.message, 'every error carries a sentence').toMatch(/\w+ \w+/);
        }
      });
    }
  }
});
