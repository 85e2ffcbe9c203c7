/**
 * Faults under the balancer: one app instance killed while reads and uploads run (no read lost, no
 * upload half-stored, every file stored exactly once after the client's retry), then the replica
 * stopped (reads go to the primary; health says so).
 */
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../tests/support/http-session';
import { Browser } from './client';
import { cluster, primaryCount, sleep, stopProcess } from './cluster';
import { type CheckResult, type Testbed, upload, uniqueLoggerFile } from './fixtures';

export async function checkInstanceStopped(testbed: Testbed): Promise<CheckResult[]> {
  const readers = 6;
  const reads = { ok: 0, failed: 0, statuses: new Map<string, number>() };
  const files: Array<ReturnType<typeof uniqueLoggerFile>> = [];
  const uploadOutcomes = { firstTry: 0, retried: 0, lost: 0 };
  let running = true;
  const readLoop = async () => {
    while (running) {
      try {
        const response = await testbed.instructor.get('/api/runs');
        await response.body?.cancel();
        if (response.status === 200) reads.ok += 1;
        else {
          reads.failed += 1;
          reads.statuses.set(String(response.status), (reads.statuses.get(String(response.status)) ?? 0) + 1);
        }
      } catch (error) {
        reads.failed += 1;
        reads.statuses.set((error as Error).message, (reads.statuses.get((error as Error).message) ?? 0) + 1);
      }
    }
  };
  const inFlightSince: number[] = [];
  const uploadLoop = async (slot: number) => {
    while (running) {
      const file = uniqueLoggerFile();
      files.push(file);
      inFlightSince[slot] = Date.now();
      const first = await upload(testbed.instructor, testbed, file).catch(() => ({ status: 0, runId: null }));
      inFlightSince[slot] = 0;
      if (first.status === 201) {
        uploadOutcomes.firstTry += 1;
        continue;
      }
      // The client tries a failed upload again: 201, or 409 naming the run when the first try was stored.
      await sleep(300);
      const again = await upload(testbed.instructor, testbed, file).catch(() => ({ status: 0, runId: null }));
      if (again.status === 201 || (again.status === 409 && again.runId !== null)) uploadOutcomes.retried += 1;
      else uploadOutcomes.lost += 1;
    }
  };
  const started = Date.now();
  const loops = [...Array.from({ length: readers }, readLoop), uploadLoop(0), uploadLoop(1)];
  await sleep(3000);
  // Kill while both uploads are being processed (one of them, most likely, on app1).
  const bothUploading = () => [0, 1].every((slot) => inFlightSince[slot]! > 0 && Date.now() - inFlightSince[slot]! > 300);
  for (let i = 0; i < 100 && !bothUploading(); i++) await sleep(50);
  const uploadsInFlight = [0, 1].filter((slot) => inFlightSince[slot]! > 0).length;
  await stopProcess('app1.pid', 'SIGKILL');
  const killedAt = Date.now();
  await sleep(6000);
  running = false;
  await Promise.all(loops);
  const ended = Date.now();
  const names = files.map((f) => f.name);
  const storedRuns = await primaryCount('SELECT COUNT(*) AS n FROM runs r JOIN uploads u ON u.run_id = r.id WHERE u.file_name IN (?)', [names]);
  const halfStored = await primaryCount(
    `SELECT COUNT(*) AS n FROM runs r WHERE r.joint_id = ? AND r.source = 'upload'
       AND (NOT EXISTS (SELECT 1 FROM uploads u WHERE u.run_id = r.id)
         OR NOT EXISTS (SELECT 1 FROM tightening_steps s WHERE s.run_id = r.id)
         OR NOT EXISTS (SELECT 1 FROM upload_chunks c JOIN uploads u ON u.id = c.upload_id WHERE u.run_id = r.id))`,
    [testbed.jointId],
  );
  const failures = [...reads.statuses].map(([what, n]) => `${what} ×${n}`).join(', ');
  return [
    {
      check: 'app1 killed under load: no read lost at the balancer',
      ok: reads.failed === 0 && reads.ok > 0,
      figures: `${reads.ok} reads 200, ${reads.failed} failed${failures ? ` (${failures})` : ''}; ${readers} readers; SIGKILL after ${((killedAt - started) / 1000).toFixed(1)} s, load went on ${((ended - killedAt) / 1000).toFixed(1)} s`,
    },
    {
      check: 'app1 killed under load: uploads stored once, none half-stored',
      ok: uploadOutcomes.lost === 0 && halfStored === 0 && storedRuns === files.length,
      figures: `${files.length} files (${uploadsInFlight} in flight at the kill): ${uploadOutcomes.firstTry} stored first time, ${uploadOutcomes.retried} after the client's retry, ${uploadOutcomes.lost} lost; ${storedRuns} runs stored; ${halfStored} half-stored`,
    },
  ];
}

export async function checkReplicaStopped(testbed: Testbed, runId: number, windowMs: number): Promise<CheckResult> {
  // A fresh browser past its read-from-primary window (its sign-in wrote): its reads go to the replica.
  const reader = new Browser(cluster.balancer);
  if (!(await reader.signIn(DEMO_ACCOUNTS.instructor, DEMO_PASSWORD))) throw new Error('the instructor could not sign in');
  await sleep(windowMs + 500);
  await stopProcess('replica/mariadb.pid', 'SIGTERM');
  const started = Date.now();
  const statuses: number[] = [];
  for (let i = 0; i < 6; i++) {
    const response = await reader.get(`/api/runs/${runId}`);
    await response.body?.cancel();
    statuses.push(response.status);
  }
  const elapsed = Date.now() - started;
  const health = (await (await fetch(`${cluster.balancer}/api/health`)).json()) as { status?: string; reads?: string };
  const ok = statuses.every((s) => s === 200) && health.status === 'ok' && health.reads === 'primary';
  return {
    check: 'replica stopped: reads go to the primary',
    ok,
    figures: `${statuses.filter((s) => s === 200).length}/6 reads 200 in ${elapsed} ms; health ${health.status}, reads from ${health.reads}`,
  };
}
