/**
 * The scale-check driver (started by scripts/scale-check.sh once the primary, the replica, two app
 * instances and HAProxy are up): runs the checks in order through the balancer, prints a table
 * (check, result, figures) and exits 1 when a check failed. Checks that stop things come last.
 */
import { sequelize } from '../../lib/platform/db';
import { env } from '../../lib/platform/env';
import { checkCompareCache, checkReadYourWrites, checkSession, checkSignInThrottle } from './checks-reads';
import { checkInvitation, checkStream } from './checks-flows';
import { checkInstanceStopped, checkReplicaStopped } from './checks-faults';
import { checkReplicaLagging } from './checks-lag';
import { cluster, primaryRows } from './cluster';
import { type CheckResult, createTestbed, type Testbed } from './fixtures';

function printTable(results: CheckResult[]): void {
  const width = Math.max(...results.map((r) => r.check.length), 5);
  console.log(`\n${'check'.padEnd(width)}  result  figures`);
  console.log(`${'-'.repeat(width)}  ------  ${'-'.repeat(60)}`);
  for (const r of results) console.log(`${r.check.padEnd(width)}  ${(r.ok ? 'pass' : 'FAIL').padEnd(6)}  ${r.figures}`);
}

async function latestRun(testbed: Testbed): Promise<number> {
  const [row] = await primaryRows<{ id: number }>("SELECT MAX(id) AS id FROM runs WHERE joint_id = ? AND source = 'upload'", [testbed.jointId]);
  return Number(row?.id ?? 0);
}

async function main(): Promise<number> {
  const windowMs = env.DB_READ_PRIMARY_AFTER_WRITE_MS;
  const testbed = await createTestbed();
  const results: CheckResult[] = [];
  const steps: Array<[string, () => Promise<CheckResult | CheckResult[]>]> = [
    ['session', () => checkSession(testbed)],
    ['read-your-writes', () => checkReadYourWrites(testbed, windowMs)],
    ['compare cache', () => checkCompareCache(testbed)],
    ['sign-in throttle', () => checkSignInThrottle()],
    ['stream', () => checkStream(testbed)],
    ['invitation', () => checkInvitation(testbed)],
  ];
  if (!cluster.skipFaults) {
    // The lagging replica first: it needs both instances (its SQL thread is started again afterwards).
    steps.push(['replica lagging', () => checkReplicaLagging(testbed, windowMs)], ['instance stopped', () => checkInstanceStopped(testbed)], ['replica stopped', async () => checkReplicaStopped(testbed, await latestRun(testbed), windowMs)]);
  }
  for (const [name, step] of steps) {
    process.stderr.write(`[scale-check] ${name}…\n`);
    try {
      results.push(...[await step()].flat());
    } catch (error) {
      results.push({ check: name, ok: false, figures: `error: ${(error as Error).message}` });
    }
  }
  printTable(results);
  const failed = results.filter((r) => !r.ok).length;
  console.log(`\nscale-check: ${results.length - failed} passed, ${failed} failed`);
  return failed === 0 ? 0 : 1;
}

main()
  .then(async (code) => {
    await sequelize.close();
    process.exit(code);
  })
  .catch(async (error) => {
    console.error(error);
    await sequelize.close().catch(() => undefined);
    process.exit(1);
  });
