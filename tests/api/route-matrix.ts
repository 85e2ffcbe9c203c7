/**
 * The role matrix: every route handler under app/api with the status each kind of caller gets.
 * tests/api/role-matrix.test.ts fails when a route file exists without an entry here.
 * `path` is a concrete URL to call; `route` is the file's route pattern.
 */
export type Caller = 'anonymous' | 'admin' | 'instructor' | 'researcher' | 'trainee';

export interface MatrixEntry {
  route: string;
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  path: string;
  body?: unknown;
  expect: Record<Caller, number>;
}

const signedIn = (status: number): Record<Caller, number> => ({ anonymous: 401, admin: status, instructor: status, researcher: status, trainee: status });

export const ROUTE_MATRIX: MatrixEntry[] = [
  { route: '/api/health', method: 'GET', path: '/api/health', expect: { anonymous: 200, admin: 200, instructor: 200, researcher: 200, trainee: 200 } },
  { route: '/api/ping', method: 'GET', path: '/api/ping', expect: { anonymous: 200, admin: 200, instructor: 200, researcher: 200, trainee: 200 } },
  { route: '/api/runs', method: 'GET', path: '/api/runs', expect: signedIn(200) },
  { route: '/api/runs/options', method: 'GET', path: '/api/runs/options', expect: signedIn(200) },
  // Run 1 of the demo scenario belongs to a spring-cohort trainee taught by the first instructor.
  { route: '/api/runs/[id]', method: 'GET', path: '/api/runs/{springRun}', expect: { anonymous: 401, admin: 200, instructor: 200, researcher: 200, trainee: 404 } },
  { route: '/api/runs/[id]/analysis', method: 'GET', path: '/api/runs/{springRun}/analysis', expect: { anonymous: 401, admin: 200, instructor: 200, researcher: 200, trainee: 404 } },
  { route: '/api/runs/[id]/export', method: 'GET', path: '/api/runs/{springRun}/export', expect: { anonymous: 401, admin: 200, instructor: 200, researcher: 200, trainee: 404 } },
  // No record has this id: the roles that may download records get 404, researchers 403.
  { route: '/api/training-records/[id]/pdf', method: 'GET', path: '/api/training-records/999999999/pdf', expect: { anonymous: 401, admin: 404, instructor: 404, researcher: 403, trainee: 404 } },
  { route: '/api/admin/audit-log', method: 'GET', path: '/api/admin/audit-log', expect: { anonymous: 401, admin: 200, instructor: 403, researcher: 403, trainee: 403 } },
  { route: '/api/compare', method: 'GET', path: '/api/compare?by=method', expect: { anonymous: 401, admin: 403, instructor: 200, researcher: 200, trainee: 403 } },
  // A saved comparison no one has: 404 for the roles of Compare (we do not reveal whether it exists).
  // A review link no one made: a plain 404 for everyone (the link, not a session, is the credential).
  { route: '/api/review/[token]/package', method: 'GET', path: '/api/review/AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA/package', expect: { anonymous: 404, admin: 404, instructor: 404, researcher: 404, trainee: 404 } },
  { route: '/api/compare/saved/[slug]/package', method: 'GET', path: '/api/compare/saved/zzzzzzzzzzzz/package', expect: { anonymous: 401, admin: 403, instructor: 404, researcher: 404, trainee: 403 } },
  // Record (issue 4). Bodies are deliberately empty or invalid: the matrix checks who gets past the door.
  { route: '/api/uploads', method: 'POST', path: '/api/uploads', expect: { anonymous: 401, admin: 403, instructor: 422, researcher: 422, trainee: 422 } },
  { route: '/api/runs/export', method: 'GET', path: '/api/runs/export?format=csv&status=complete', expect: signedIn(200) },
  // A run id no one has: 404 for every signed-in caller (we do not reveal whether it exists).
  { route: '/api/runs/[id]/stream', method: 'GET', path: '/api/runs/999999999/stream', expect: signedIn(404) },
  // Without a bearer token the endpoint takes the session of the people who record (Connect logger): a run no one has is 404 for them.
  { route: '/api/runs/[id]/stream', method: 'POST', path: '/api/runs/999999999/stream', body: '{"t":0,"stud":1,"load":0}', expect: { anonymous: 401, admin: 403, instructor: 404, researcher: 404, trainee: 404 } },
  // The bridge's line format takes a bearer token, not a session: without one everyone gets 401.
  { route: '/api/stream/line-format', method: 'GET', path: '/api/stream/line-format', expect: { anonymous: 401, admin: 401, instructor: 401, researcher: 401, trainee: 401 } },
  {
    route: '/api/exports/runs.csv',
    method: 'POST',
    path: '/api/exports/runs.csv',
    body: { key: 'role-matrix-key', from: '2026-01-01', to: '2026-01-31' },
    expect: { anonymous: 401, admin: 200, instructor: 403, researcher: 200, trainee: 403 },
  },
];

/** Routes that are not ours to check here (next-auth's own endpoints). */
export const EXEMPT_ROUTES = ['/api/auth/[...nextauth]'];
