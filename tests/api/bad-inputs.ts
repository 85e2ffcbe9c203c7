/**
 * The bad-input corpus across the API: malformed values, wrong types, out-of-range numbers, SQL and
 * HTML injection strings, path tricks and other users' objects. `{othersRun}` is a run of a trainee
 * other than the demo trainee.
 */
export type Caller = 'anonymous' | 'admin' | 'instructor' | 'researcher' | 'trainee';

export interface BadInput {
  name: string;
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  path: string;
  as: Caller;
  status: number;
  body?: unknown;
  headers?: Record<string, string>;
  message?: RegExp;
}

/** A multipart upload whose file is over the 20 MB limit (built lazily: 21 MB of text). */
function oversizedUpload(): FormData {
  const form = new FormData();
  form.set('file', new Blob(['time_s,Stud 1\n', '0,1\n'.repeat(5.5 * 1024 * 1024)], { type: 'text/csv' }), 'huge.csv');
  form.set('mapping', 'null');
  form.set('header', '{}');
  return form;
}

const sqlInjection = encodeURIComponent("1' OR '1'='1");
const dropTable = encodeURIComponent('1; DROP TABLE runs; --');
const script = encodeURIComponent('<script>alert(1)</script>');

export const BAD_INPUTS: BadInput[] = [
  // GET /api/runs: query validation
  { name: 'page size not a number', method: 'GET', path: '/api/runs?pageSize=abc', as: 'researcher', status: 422, message: /pageSize/ },
  { name: 'negative page size', method: 'GET', path: '/api/runs?pageSize=-1', as: 'researcher', status: 422, message: /pageSize/ },
  { name: 'huge page size', method: 'GET', path: '/api/runs?pageSize=100000', as: 'researcher', status: 422, message: /pageSize/ },
  { name: 'page zero', method: 'GET', path: '/api/runs?page=0', as: 'researcher', status: 422, message: /page/ },
  { name: 'fractional page', method: 'GET', path: '/api/runs?page=1.5', as: 'researcher', status: 422, message: /page/ },
  { name: 'method id as text', method: 'GET', path: '/api/runs?methodId=abc', as: 'researcher', status: 422, message: /methodId/ },
  { name: 'SQL injection in a filter', method: 'GET', path: `/api/runs?methodId=${sqlInjection}`, as: 'researcher', status: 422, message: /methodId/ },
  { name: 'stacked query in a filter', method: 'GET', path: `/api/runs?cohortId=${dropTable}`, as: 'researcher', status: 422, message: /cohortId/ },
  { name: 'HTML in a filter', method: 'GET', path: `/api/runs?lubricantId=${script}`, as: 'researcher', status: 422, message: /lubricantId/ },
  { name: 'id beyond the integer range', method: 'GET', path: '/api/runs?operatorId=99999999999999999999', as: 'researcher', status: 422, message: /operatorId/ },
  { name: 'date in words', method: 'GET', path: '/api/runs?from=yesterday', as: 'researcher', status: 422, message: /from/ },
  { name: 'SQL in a date', method: 'GET', path: `/api/runs?to=${encodeURIComponent("2026-01-01' OR ''='")}`, as: 'researcher', status: 422, message: /to/ },
  { name: 'dates the wrong way round', method: 'GET', path: '/api/runs?from=2026-06-01&to=2026-01-01', as: 'researcher', status: 422, message: /to/ },
  { name: 'sort by a column that is not offered', method: 'GET', path: '/api/runs?sort=password_hash', as: 'researcher', status: 422, message: /sort/ },
  { name: 'SQL in the sort', method: 'GET', path: `/api/runs?sort=${encodeURIComponent('recorded_at; DELETE FROM runs')}`, as: 'researcher', status: 422, message: /sort/ },
  { name: 'unknown direction', method: 'GET', path: '/api/runs?dir=sideways', as: 'researcher', status: 422, message: /dir/ },
  { name: 'unknown status', method: 'GET', path: '/api/runs?status=deleted', as: 'researcher', status: 422, message: /status/ },
  { name: 'unknown source', method: 'GET', path: '/api/runs?source=ftp', as: 'researcher', status: 422, message: /source/ },
  { name: 'unknown parameter', method: 'GET', path: '/api/runs?admin=true', as: 'trainee', status: 422, message: /admin/ },
  { name: 'signed out', method: 'GET', path: '/api/runs', as: 'anonymous', status: 401, message: /Sign in/ },
  // GET /api/runs/:id and its sub-resources
  { name: 'run id as text', method: 'GET', path: '/api/runs/abc', as: 'researcher', status: 422, message: /id/ },
  { name: 'negative run id', method: 'GET', path: '/api/runs/-1', as: 'researcher', status: 422, message: /id/ },
  { name: 'fractional run id', method: 'GET', path: '/api/runs/1.5', as: 'researcher', status: 422, message: /id/ },
  { name: 'run that does not exist', method: 'GET', path: '/api/runs/2000000000', as: 'researcher', status: 404, message: /does not exist/ },
  { name: 'path trick in the run id', method: 'GET', path: '/api/runs/..%2F..%2Fetc%2Fpasswd', as: 'researcher', status: 422, message: /id/ },
  { name: 'SQL injection in the run id', method: 'GET', path: `/api/runs/${sqlInjection}`, as: 'researcher', status: 422, message: /id/ },
  { name: "another trainee's run", method: 'GET', path: '/api/runs/{othersRun}', as: 'trainee', status: 404, message: /not yours/ },
  { name: "another trainee's analysis", method: 'GET', path: '/api/runs/{othersRun}/analysis', as: 'trainee', status: 404, message: /not yours/ },
  { name: "another trainee's export", method: 'GET', path: '/api/runs/{othersRun}/export', as: 'trainee', status: 404, message: /not yours/ },
  { name: 'export in an unknown format', method: 'GET', path: '/api/runs/{othersRun}/export?format=xml', as: 'researcher', status: 422, message: /format/ },
  { name: 'export in unknown units', method: 'GET', path: '/api/runs/{othersRun}/export?units=metric', as: 'researcher', status: 422, message: /units/ },
  { name: 'export with an unknown parameter', method: 'GET', path: '/api/runs/{othersRun}/export?file=../../.env', as: 'researcher', status: 422, message: /file/ },
  // GET /api/compare
  { name: 'compare by an unknown dimension', method: 'GET', path: '/api/compare?by=colour', as: 'researcher', status: 422, message: /by/ },
  { name: 'group list with text', method: 'GET', path: '/api/compare?ids=1,2,x', as: 'researcher', status: 422, message: /ids/ },
  { name: 'more than eight groups', method: 'GET', path: '/api/compare?ids=1,2,3,4,5,6,7,8,9', as: 'researcher', status: 422, message: /ids/ },
  { name: 'hand-picked comparison of one run', method: 'GET', path: '/api/compare?by=runs&ids=1', as: 'researcher', status: 422, message: /ids/ },
  { name: 'compare dates the wrong way round', method: 'GET', path: '/api/compare?from=2026-05-01&to=2026-01-01', as: 'instructor', status: 422, message: /to/ },
  { name: 'pass count zero', method: 'GET', path: '/api/compare?passCount=0', as: 'researcher', status: 422, message: /passCount/ },
  { name: 'pass count absurd', method: 'GET', path: '/api/compare?passCount=999', as: 'researcher', status: 422, message: /passCount/ },
  { name: 'HTML in the comparison choice', method: 'GET', path: `/api/compare?by=${script}`, as: 'researcher', status: 422, message: /by/ },
  { name: 'compare as a trainee', method: 'GET', path: '/api/compare', as: 'trainee', status: 403, message: /role/ },
  // POST /api/uploads: bodies that are not an upload
  { name: 'upload sent as JSON', method: 'POST', path: '/api/uploads', as: 'instructor', status: 422, body: { file: 'wide.csv' }, message: /multipart/ },
  { name: 'upload sent as malformed JSON', method: 'POST', path: '/api/uploads', as: 'trainee', status: 422, body: '{"file": ', headers: { 'content-type': 'application/json' }, message: /multipart/ },
  { name: 'upload of a 21 MB file', method: 'POST', path: '/api/uploads', as: 'researcher', status: 413, body: oversizedUpload(), message: /20 MB/ },
  { name: 'upload by an admin (not a recording role)', method: 'POST', path: '/api/uploads', as: 'admin', status: 403, body: {}, message: /role/ },
  // POST /api/runs/:id/stream: the bridge endpoint
  { name: 'stream without a token', method: 'POST', path: '/api/runs/{othersRun}/stream', as: 'anonymous', status: 401, body: '{"t":0,"stud":1,"load":1}\n' },
  { name: 'stream with a made-up token', method: 'POST', path: '/api/runs/{othersRun}/stream', as: 'anonymous', status: 401, body: '{"t":0,"stud":1,"load":1}\n', headers: { authorization: 'Bearer not-a-real-token' } },
  { name: 'stream with SQL in the token', method: 'POST', path: '/api/runs/{othersRun}/stream', as: 'anonymous', status: 401, body: '{"t":0', headers: { authorization: "Bearer ' OR '1'='1" } },
  // Verbs a route does not take, and bodies where none belongs
  { name: 'POST to the runs list', method: 'POST', path: '/api/runs', as: 'instructor', status: 405, body: { id: 1 } },
  { name: 'DELETE a run through the read route', method: 'DELETE', path: '/api/runs/{othersRun}', as: 'admin', status: 405 },
  { name: 'PUT to the comparison', method: 'PUT', path: '/api/compare', as: 'researcher', status: 405, body: '{"by":' },
];
