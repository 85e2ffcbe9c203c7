/**
 * Checks of state shared through MariaDB across the two instances: the session, read-your-writes
 * after an upload (and, as the control, that another browser's reads do go to the delayed replica),
 * the comparison cache and the sign-in throttle.
 */
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../tests/support/http-session';
import { Browser } from './client';
import { cluster, primaryRows, sleep } from './cluster';
import { byInstance, type CheckResult, type Testbed, upload } from './fixtures';

export async function checkSession(testbed: Testbed): Promise<CheckResult> {
  const start = testbed.instructor.instances.length;
  const statuses: number[] = [];
  for (let i = 0; i < 6; i++) statuses.push((await testbed.instructor.get('/api/runs')).status);
  const instances = testbed.instructor.instances.slice(start);
  const ok = statuses.every((s) => s === 200) && new Set(instances).size === 2;
  return { check: 'signed in once, session holds on both instances', ok, figures: `${statuses.filter((s) => s === 200).length}/6 reads 200 (${byInstance(instances)})` };
}

/**
 * Uploads and opens each run at once (API and report page) from the same browser; another browser
 * of the same person, whose read-from-primary window has passed, opens it at once too: while the
 * replica is behind by its delay it must not find the run yet (its reads do go to the replica).
 */
export async function checkReadYourWrites(testbed: Testbed, windowMs: number): Promise<CheckResult[]> {
  const other = new Browser(cluster.balancer);
  await other.signIn(DEMO_ACCOUNTS.instructor, DEMO_PASSWORD);
  await sleep(windowMs + 500); // the other browser's own window (its sign-in wrote) has passed
  let seen = 0;
  let crossInstance = 0;
  let otherMissed = 0;
  const rounds = 6;
  for (let i = 0; i < rounds; i++) {
    const stored = await upload(testbed.instructor, testbed);
    const wroteOn = testbed.instructor.lastInstance;
    if (stored.status !== 201 || stored.runId === null) continue;
    const reads = [
      await testbed.instructor.get(`/api/runs/${stored.runId}`),
      await testbed.instructor.get(`/api/runs/${stored.runId}/analysis`),
      await testbed.instructor.get(`/runs/${stored.runId}`),
    ];
    const readOn = testbed.instructor.instances.slice(-3);
    if (reads.every((r) => r.status === 200)) seen += 1;
    if (readOn.some((name) => name !== wroteOn)) crossInstance += 1;
    if ((await other.get(`/api/runs/${stored.runId}`)).status === 404) otherMissed += 1;
    await Promise.all(reads.map((r) => r.body?.cancel()));
  }
  return [
    {
      check: 'read-your-writes: upload, then open run + analysis + report at once',
      ok: seen === rounds && crossInstance > 0,
      figures: `${seen}/${rounds} opened at once; ${crossInstance} read on the other instance; replica ${cluster.replicaDelayS} s behind`,
    },
    {
      check: 'reads go to the replica (control: another browser)',
      ok: cluster.replicaDelayS === 0 || otherMissed > 0,
      figures: `${otherMissed}/${rounds} not yet visible to another browser (replica delay ${cluster.replicaDelayS} s)`,
    },
  ];
}

/** The same comparison on both instances: computed once, then served from the shared cache. */
export async function checkCompareCache(testbed: Testbed): Promise<CheckResult> {
  const query = '/api/compare?by=method';
  const cacheRows = () => primaryRows<{ n: number; latest: string | null }>('SELECT COUNT(*) AS n, MAX(created_at) AS latest FROM comparison_cache');
  const before = (await cacheRows())[0]!;
  const timedGet = async () => {
    const t0 = Date.now();
    const response = await testbed.instructor.get(query);
    const body = await response.text();
    return { status: response.status, body, ms: Date.now() - t0, on: testbed.instructor.lastInstance, cache: (await cacheRows())[0]! };
  };
  const first = await timedGet();
  const second = await timedGet();
  const stored = Number(first.cache.n) - Number(before.n);
  const sameBody = first.body === second.body;
  const noNewRow = Number(second.cache.n) === Number(first.cache.n) && String(second.cache.latest) === String(first.cache.latest);
  const ok = first.status === 200 && second.status === 200 && first.on !== second.on && sameBody && stored === 1 && noNewRow;
  return {
    check: 'comparison cache shared: computed on one, served on the other',
    ok,
    figures: `${first.on} computed in ${first.ms} ms (+${stored} cache row); ${second.on} served in ${second.ms} ms, same body ${sameBody}, no new row ${noNewRow}`,
  };
}

/** Five wrong passwords for one account from a client that drops cookies lock that account for it, whichever instance answers. */
export async function checkSignInThrottle(): Promise<CheckResult> {
  const guesser = new Browser(cluster.balancer);
  const failedOn: string[] = [];
  for (let i = 0; i < 5; i++) {
    guesser.clearCookies();
    // A sign-in is two requests (CSRF token, then the post): one more every other time moves the post to the other instance.
    if (i % 2 === 1) await (await guesser.get('/api/auth/csrf')).body?.cancel();
    if (await guesser.signIn(DEMO_ACCOUNTS.researcher, `wrong-password-${i}`)) return { check: 'sign-in throttle across instances', ok: false, figures: 'a wrong password signed in' };
    failedOn.push(guesser.lastInstance);
  }
  guesser.clearCookies();
  const rightPasswordSignedIn = await guesser.signIn(DEMO_ACCOUNTS.researcher, DEMO_PASSWORD);
  return {
    check: 'sign-in throttle across instances',
    ok: !rightPasswordSignedIn && new Set(failedOn).size === 2,
    figures: `5 failures (${byInstance(failedOn)}); then the right password on ${guesser.lastInstance}: ${rightPasswordSignedIn ? 'signed in' : 'refused'}`,
  };
}
