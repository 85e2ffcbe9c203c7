/**
 * Multi-request flows through the balancer: a live stream whose batches land on both instances, and
 * an invitation sent by an instructor and accepted by the newcomer (server actions over HTTP, as the
 * browser calls them).
 */
import { createStreamToken } from '../../lib/data/stream-tokens';
import { startRecording } from '../../lib/data/runs/live-stream';
import { DEMO_ACCOUNTS } from '../../tests/support/http-session';
import { header } from '../../tests/support/record-fixtures';
import { callServerAction } from '../../tests/support/server-action';
import { sessionUserOf } from '../../tests/support/session-users';
import { wideFixtureAsStream } from '../../tests/support/stream-fixture';
import { Browser, INSTANCE_HEADER } from './client';
import { cluster, primaryCount, primaryRows, replicaCaughtUp, sleep } from './cluster';
import { byInstance, type CheckResult, type Testbed } from './fixtures';

const IDLE = { status: 'idle', message: null };

export async function checkStream(testbed: Testbed): Promise<CheckResult> {
  const instructor = await sessionUserOf(DEMO_ACCOUNTS.instructor);
  const { runId } = await startRecording(instructor, header(testbed.jointId, instructor.id, testbed.ids));
  const { token } = await createStreamToken(instructor, testbed.jointId, 'scale-check bay (invented)');
  // The bridge starts after the recording exists everywhere (a bridge holds no cookie).
  await replicaCaughtUp();
  const rows = wideFixtureAsStream().csv.trim().split('\n').slice(1).map((line) => {
    const [t, stud, load] = line.split(',').map(Number);
    return JSON.stringify({ t, stud, load });
  });
  const batchSize = Math.ceil(rows.length / 12);
  const landedOn: string[] = [];
  const statuses: number[] = [];
  for (let i = 0; i < rows.length; i += batchSize) {
    const response = await fetch(`${cluster.balancer}/api/runs/${runId}/stream`, {
      method: 'POST',
      headers: { authorization: `Bearer ${token}` },
      body: rows.slice(i, i + batchSize).join('\n'),
    });
    await response.body?.cancel();
    statuses.push(response.status);
    landedOn.push(response.headers.get(INSTANCE_HEADER) ?? '?');
  }
  // The page polls; another client's writes reach it once the replica has them.
  const finished = Date.now();
  let sampleCount = -1;
  while (Date.now() - finished < (cluster.replicaDelayS + 15) * 1000) {
    sampleCount = ((await (await testbed.instructor.get(`/api/runs/${runId}/stream`)).json()) as { sampleCount?: number }).sampleCount ?? -1;
    if (sampleCount >= rows.length) break;
    await sleep(250);
  }
  const seenAfterMs = Date.now() - finished;
  const ok = statuses.every((s) => s === 200) && new Set(landedOn).size === 2 && sampleCount === rows.length;
  return {
    check: 'stream: batches on both instances, every reading stored once',
    ok,
    figures: `${statuses.length} batches (${byInstance(landedOn)}), ${statuses.filter((s) => s === 200).length} accepted; ${sampleCount}/${rows.length} readings, shown on the page after ${seenAfterMs} ms`,
  };
}

export async function checkInvitation(testbed: Testbed): Promise<CheckResult> {
  const [cohort] = await primaryRows<{ id: number }>('SELECT c.id FROM cohorts c JOIN users u ON u.id = c.instructor_id WHERE u.email = ? ORDER BY c.id LIMIT 1', [DEMO_ACCOUNTS.instructor]);
  if (!cohort) return { check: 'invite and accept', ok: false, figures: 'the demo instructor has no cohort' };
  const email = `scale-check-${Date.now()}@example.test`;
  const form = new FormData();
  form.append('addresses', email);
  const invite = await callServerAction(testbed.instructor, cluster.balancer, `/cohorts/${cohort.id}`, 'app/(lab)/cohorts/actions.ts', 'inviteAction', [Number(cohort.id), IDLE, form]);
  const invitedOn = testbed.instructor.lastInstance;
  await invite.body?.cancel();
  let text = '';
  for (let i = 0; i < 100 && !text; i++) {
    const [mail] = await primaryRows<{ text_body: string }>('SELECT text_body FROM captured_mail WHERE FIND_IN_SET(?, envelope_to) ORDER BY id LIMIT 1', [email]);
    text = mail?.text_body ?? '';
    if (!text) await sleep(100);
  }
  const token = text.match(/https?:\/\/\S+\/welcome\/([A-Za-z0-9_-]{43})/)?.[1];
  if (!token) return { check: 'invite and accept', ok: false, figures: `invite answered ${invite.status} on ${invitedOn}; no welcome link mailed` };
  // The newcomer opens the link at once, chooses a password and signs in (a fresh browser).
  const newcomer = new Browser(cluster.balancer);
  const landing = await newcomer.get(`/welcome/${token}`);
  const landingText = await landing.text();
  const landingOk = landing.status === 200 && landingText.includes(email);
  const password = 'scale-check password 1';
  const accept = new FormData();
  accept.append('name', 'Scale Check (invented)');
  accept.append('password', password);
  accept.append('confirm', password);
  const accepted = await callServerAction(newcomer, cluster.balancer, `/welcome/${token}`, 'app/(auth)/actions.ts', 'setPasswordAction', [token, 'invite', IDLE, accept]);
  const acceptedText = await accepted.text();
  const acceptedOn = newcomer.lastInstance;
  const signedIn = await newcomer.signIn(email, password);
  const signedInOn = newcomer.lastInstance;
  const member = await primaryCount('SELECT COUNT(*) AS n FROM cohort_members m JOIN users u ON u.id = m.user_id WHERE u.email = ? AND m.cohort_id = ?', [email, cohort.id]);
  const ok = landingOk && acceptedText.includes('Password set') && signedIn && member === 1;
  return {
    check: 'invite and accept (link opened at once)',
    ok,
    figures: `invited on ${invitedOn}; landing ${landing.status}${landingOk ? '' : ' (no address shown)'}; password set on ${acceptedOn}; signed in on ${signedInOn}: ${signedIn}; member ${member === 1}`,
  };
}
