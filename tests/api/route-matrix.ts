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
  { route: '/api/runs', method: 'GET', path: '/api/runs', expect: signedIn(200) },
  { route: '/api/runs/options', method: 'GET', path: '/api/runs/options', expect: signedIn(200) },
  {
    route: '/api/exports/runs.csv',
    method: 'GET',
    path: '/api/exports/runs.csv?key=role-matrix-key&from=2026-01-01&to=2026-01-31',
    expect: { anonymous: 401, admin: 200, instructor: 403, researcher: 200, trainee: 403 },
  },
];

/** Routes that are not ours to check here (next-auth's own endpoints). */
export const EXEMPT_ROUTES = ['/api/auth/[...nextauth]'];
