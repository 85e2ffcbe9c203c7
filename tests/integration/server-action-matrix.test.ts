import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import type { SessionUser } from '@/lib/auth/session';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import type { Role } from '@/models/user';
import { DEMO_ACCOUNTS } from '../support/http-session';
import { sessionUserFor } from './support';

// The role matrix for server actions: every exported action of every 'use server' file, called as
// each kind of caller with the session supplied here. Callers outside `allowed` must be refused
// and change no row anywhere; allowed callers must get past the role check (they may still be
// told a field is wrong). The test fails when an action exists without an entry.
const signedIn = vi.hoisted(() => ({ user: null as SessionUser | null }));
vi.mock('@/lib/auth/session', async (importOriginal) => ({ ...(await importOriginal<typeof import('@/lib/auth/session')>()), getSessionUser: async () => signedIn.user }));
vi.mock('next/cache', () => ({ revalidatePath: vi.fn() }));
vi.mock('next/navigation', async (importOriginal) => ({
  ...(await importOriginal<typeof import('next/navigation')>()),
  redirect: (url: string) => {
    throw Object.assign(new Error(`redirect to ${url}`), { redirectedTo: url });
  },
}));

const cohorts = await import('@/app/(lab)/cohorts/actions');
const classroom = await import('@/app/(lab)/classroom/actions');
const joints = await import('@/app/(lab)/joints/actions');
const record = await import('@/app/(lab)/record/actions');
const comments = await import('@/app/(lab)/runs/[id]/actions');
const hardware = await import('@/app/(lab)/joints/hardware/actions');
const people = await import('@/app/(lab)/people/actions');
const lab = await import('@/app/(lab)/actions');
const calibration = await import('@/app/(lab)/joints/[id]/calibration/actions');
const equipment = await import('@/app/(lab)/equipment/actions');
const saved = await import('@/app/(lab)/compare/saved/actions');
const trainee = await import('@/app/(lab)/cohorts/[id]/trainees/[userId]/actions');
const jobs = await import('@/app/(lab)/admin/jobs/actions');

type Caller = Role | 'anonymous';
const CALLERS: Caller[] = ['anonymous', 'admin', 'instructor', 'researcher', 'trainee'];
const ids = { cohort: 0, run: 0, trainee: 0, joint: 0 };
const form = () => new FormData();
const idle = IDLE_FORM_STATE;

interface ActionEntry {
  file: string;
  name: string;
  allowed: Caller[];
  call: () => Promise<unknown>;
}

const ACTIONS: ActionEntry[] = [
  { file: 'app/(lab)/cohorts/actions.ts', name: 'createCohortAction', allowed: ['instructor', 'admin'], call: () => cohorts.createCohortAction(idle, form()) },
  { file: 'app/(lab)/cohorts/actions.ts', name: 'inviteAction', allowed: ['instructor', 'admin'], call: () => cohorts.inviteAction(ids.cohort, idle, form()) },
  { file: 'app/(lab)/cohorts/actions.ts', name: 'saveCriteriaAction', allowed: ['instructor', 'admin'], call: () => cohorts.saveCriteriaAction(ids.cohort, idle, form()) },
  { file: 'app/(lab)/cohorts/actions.ts', name: 'signOffAction', allowed: ['instructor', 'admin'], call: () => cohorts.signOffAction(ids.cohort, ids.run, idle, form()) },
  { file: 'app/(lab)/cohorts/actions.ts', name: 'sendResultsAction', allowed: ['instructor', 'admin'], call: () => cohorts.sendResultsAction(ids.cohort, ids.run, idle, form()) },
  { file: 'app/(lab)/classroom/actions.ts', name: 'saveSceneAction', allowed: ['instructor'], call: () => classroom.saveSceneAction(idle, form()) },
  { file: 'app/(lab)/joints/actions.ts', name: 'saveJointAction', allowed: ['instructor', 'admin'], call: () => joints.saveJointAction(null, idle, form()) },
  { file: 'app/(lab)/joints/actions.ts', name: 'saveMethodAction', allowed: ['instructor', 'admin'], call: () => joints.saveMethodAction(null, idle, form()) },
  { file: 'app/(lab)/joints/actions.ts', name: 'saveLubricantAction', allowed: ['instructor', 'admin'], call: () => joints.saveLubricantAction(null, idle, form()) },
  { file: 'app/(lab)/record/actions.ts', name: 'saveManualRunAction', allowed: ['instructor', 'researcher', 'trainee'], call: () => record.saveManualRunAction(idle, form()) },
  { file: 'app/(lab)/record/actions.ts', name: 'saveSimulatedRunAction', allowed: ['instructor', 'researcher', 'trainee'], call: () => record.saveSimulatedRunAction(idle, form()) },
  { file: 'app/(lab)/record/actions.ts', name: 'saveRecordPreferencesAction', allowed: ['instructor', 'researcher', 'trainee'], call: () => record.saveRecordPreferencesAction(idle, form()) },
  { file: 'app/(lab)/record/actions.ts', name: 'startRecordingAction', allowed: ['instructor', 'researcher', 'trainee'], call: () => record.startRecordingAction(idle, form()) },
  { file: 'app/(lab)/record/actions.ts', name: 'finishRecordingAction', allowed: ['instructor', 'researcher', 'trainee'], call: () => record.finishRecordingAction(idle, form()) },
  { file: 'app/(lab)/record/actions.ts', name: 'createStreamTokenAction', allowed: ['instructor'], call: () => record.createStreamTokenAction(idle, form()) },
  { file: 'app/(lab)/record/actions.ts', name: 'revokeStreamTokenAction', allowed: ['instructor'], call: () => record.revokeStreamTokenAction(idle, form()) },
  { file: 'app/(lab)/joints/hardware/actions.ts', name: 'createHardwareSetAction', allowed: ['instructor', 'admin'], call: () => hardware.createHardwareSetAction(idle, form()) },
  { file: 'app/(lab)/joints/hardware/actions.ts', name: 'updateConditionAction', allowed: ['instructor', 'admin'], call: () => hardware.updateConditionAction(0, idle, form()) },
  { file: 'app/(lab)/joints/hardware/actions.ts', name: 'createLubricantLotAction', allowed: ['instructor', 'admin'], call: () => hardware.createLubricantLotAction(idle, form()) },
  { file: 'app/(lab)/runs/[id]/actions.ts', name: 'addHoldsAction', allowed: ['instructor', 'researcher', 'admin'], call: () => comments.addHoldsAction(ids.run, idle, form()) },
  { file: 'app/(lab)/runs/[id]/actions.ts', name: 'addCommentAction', allowed: ['instructor', 'admin'], call: () => comments.addCommentAction(ids.run, idle, (() => { const f = form(); f.set('body', 'matrix comment'); return f; })()) },
  // Issue 17. Empty reasons and an already assessed run: callers who get past the role check change nothing.
  // setAsideAction is the one set-aside of both the attempt panel and the needs-review panel.
  { file: 'app/(lab)/runs/[id]/actions.ts', name: 'confirmAttemptAction', allowed: ['instructor'], call: () => comments.confirmAttemptAction(ids.run, idle, form()) },
  { file: 'app/(lab)/runs/[id]/actions.ts', name: 'setAsideAction', allowed: ['instructor', 'researcher', 'admin'], call: () => comments.setAsideAction(ids.run, idle, form()) },
  { file: 'app/(lab)/runs/[id]/actions.ts', name: 'restoreRunAction', allowed: ['instructor', 'researcher', 'admin'], call: () => comments.restoreRunAction(ids.run, idle, form()) },
  { file: 'app/(lab)/cohorts/actions.ts', name: 'resendInviteAction', allowed: ['instructor', 'admin'], call: () => cohorts.resendInviteAction(ids.trainee, ids.cohort, idle, form()) },
  // A complete run: allowed callers get "does not need review" (409), changing nothing.
  { file: 'app/(lab)/runs/[id]/actions.ts', name: 'reviewRunAction', allowed: ['instructor', 'researcher', 'admin'], call: () => comments.reviewRunAction(ids.run, idle, (() => { const f = form(); f.set('decision', 'confirm'); f.set('note', 'matrix review'); return f; })()) },
  { file: 'app/(lab)/people/actions.ts', name: 'changeRoleAction', allowed: ['admin'], call: () => people.changeRoleAction(ids.trainee, idle, form()) },
  { file: 'app/(lab)/people/actions.ts', name: 'setActiveAction', allowed: ['admin'], call: () => people.setActiveAction(ids.trainee, true, idle, form()) },
  { file: 'app/(lab)/people/actions.ts', name: 'endSessionsAction', allowed: ['admin'], call: () => people.endSessionsAction(ids.trainee, idle, form()) },
  { file: 'app/(lab)/joints/[id]/calibration/actions.ts', name: 'recordCalibrationAction', allowed: ['instructor', 'admin'], call: () => calibration.recordCalibrationAction(ids.joint, idle, form()) },
  { file: 'app/(lab)/joints/[id]/calibration/actions.ts', name: 'saveLimitsAction', allowed: ['admin'], call: () => calibration.saveLimitsAction(ids.joint, idle, form()) },
  { file: 'app/(lab)/joints/[id]/calibration/actions.ts', name: 'correctCalibrationAction', allowed: ['instructor', 'admin'], call: () => calibration.correctCalibrationAction(ids.joint, 0, idle, form()) },
  { file: 'app/(lab)/equipment/actions.ts', name: 'saveEquipmentAction', allowed: ['admin'], call: () => equipment.saveEquipmentAction(null, idle, form()) },
  { file: 'app/(lab)/runs/[id]/actions.ts', name: 'setRunToolsAction', allowed: ['instructor', 'admin'], call: () => comments.setRunToolsAction(ids.run, idle, form()) },
  // An empty form: allowed callers are told the title and query are missing; nothing is frozen.
  // A saved comparison no one has: allowed callers are told it does not exist; no link is made or withdrawn.
  { file: 'app/(lab)/compare/saved/actions.ts', name: 'createReviewLinkAction', allowed: ['instructor', 'researcher'], call: () => saved.createReviewLinkAction('zzzzzzzzzzzz', idle, form()) },
  { file: 'app/(lab)/compare/saved/actions.ts', name: 'revokeReviewLinkAction', allowed: ['instructor', 'researcher'], call: () => saved.revokeReviewLinkAction('zzzzzzzzzzzz', 0, idle, form()) },
  { file: 'app/(lab)/compare/saved/actions.ts', name: 'freezeComparisonAction', allowed: ['instructor', 'researcher'], call: () => saved.freezeComparisonAction(idle, form()) },
  // Empty forms, no pass decided and record id 0: allowed callers are refused on the facts, changing nothing.
  { file: 'app/(lab)/cohorts/[id]/trainees/[userId]/actions.ts', name: 'decideOutcomeAction', allowed: ['instructor', 'admin'], call: () => trainee.decideOutcomeAction(ids.cohort, ids.trainee, idle, form()) },
  { file: 'app/(lab)/cohorts/[id]/trainees/[userId]/actions.ts', name: 'recordValidityAction', allowed: ['instructor', 'admin'], call: () => trainee.recordValidityAction(ids.cohort, ids.trainee, idle, form()) },
  { file: 'app/(lab)/cohorts/[id]/trainees/[userId]/actions.ts', name: 'issueRecordAction', allowed: ['instructor', 'admin'], call: () => trainee.issueRecordAction(ids.cohort, ids.trainee, idle, form()) },
  { file: 'app/(lab)/cohorts/[id]/trainees/[userId]/actions.ts', name: 'revokeRecordAction', allowed: ['instructor', 'admin'], call: () => trainee.revokeRecordAction(ids.cohort, ids.trainee, 0, idle, form()) },
  { file: 'app/(lab)/cohorts/[id]/trainees/[userId]/actions.ts', name: 'reissueRecordAction', allowed: ['instructor', 'admin'], call: () => trainee.reissueRecordAction(ids.cohort, ids.trainee, 0, idle, form()) },
  // Job 0 does not exist: the admin is told so (404), changing nothing.
  { file: 'app/(lab)/admin/jobs/actions.ts', name: 'retryJobAction', allowed: ['admin'], call: () => jobs.retryJobAction(0, idle, form()) },
  // Issue 17 item 3: empty forms; allowed callers are told a field is wrong, changing nothing (zod at the boundary).
  { file: 'app/(lab)/cohorts/[id]/trainees/[userId]/actions.ts', name: 'theoryPassMarkAction', allowed: ['instructor', 'admin'], call: () => trainee.theoryPassMarkAction(ids.cohort, ids.trainee, idle, form()) },
  { file: 'app/(lab)/cohorts/[id]/trainees/[userId]/actions.ts', name: 'theoryResultAction', allowed: ['instructor', 'admin'], call: () => trainee.theoryResultAction(ids.cohort, ids.trainee, idle, form()) },
  { file: 'app/(lab)/cohorts/[id]/trainees/[userId]/actions.ts', name: 'checklistAction', allowed: ['instructor', 'admin'], call: () => trainee.checklistAction(ids.cohort, ids.trainee, idle, form()) },
  { file: 'app/(lab)/cohorts/[id]/trainees/[userId]/actions.ts', name: 'checklistTickAction', allowed: ['instructor', 'admin'], call: () => trainee.checklistTickAction(ids.cohort, ids.trainee, idle, form()) },
  { file: 'app/(lab)/actions.ts', name: 'signOutEverywhereAction', allowed: ['admin', 'instructor', 'researcher', 'trainee'], call: () => lab.signOutEverywhereAction(idle, form()) },
];

/** Public actions (a one-time link or an e-mail address is the credential): covered by tests/integration/cohorts.test.ts. */
const PUBLIC_ACTIONS = ['app/(auth)/actions.ts#setPasswordAction', 'app/(auth)/actions.ts#requestResetAction'];

const REFUSAL = /role does not allow|sign in|not open to your role|only (an )?(instructor|admin)|not allowed|forbidden/i;
const root = path.resolve(__dirname, '../..');
const users = {} as Record<Role, SessionUser>;

async function everyTableCount(): Promise<Record<string, number>> {
  const tables = (await sequelize.query<Record<string, string>>('SHOW TABLES', { type: QueryTypes.SELECT }))
    .map((row) => Object.values(row)[0] as string)
    .filter((t) => !['sign_in_attempts', 'comparison_cache'].includes(t));
  const counts: Record<string, number> = {};
  for (const table of tables) counts[table] = Number((await sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM \`${table}\``, { type: QueryTypes.SELECT }))[0]!.n);
  return counts;
}

async function outcome(entry: ActionEntry): Promise<string> {
  try {
    return JSON.stringify(await entry.call());
  } catch (error) {
    return `thrown: ${error instanceof Error ? error.message : String(error)}`;
  }
}

beforeAll(async () => {
  for (const role of ['admin', 'instructor', 'researcher', 'trainee'] as const) users[role] = await sessionUserFor(DEMO_ACCOUNTS[role]);
  const [row] = await sequelize.query<{ cohort: number; run: number; joint: number }>(
    "SELECT c.id AS cohort, r.id AS run, r.joint_id AS joint FROM cohorts c JOIN runs r ON r.cohort_id = c.id AND r.status = 'complete' WHERE c.instructor_id = ? ORDER BY r.id LIMIT 1",
    { type: QueryTypes.SELECT, replacements: [users.instructor.id] },
  );
  Object.assign(ids, { cohort: Number(row!.cohort), run: Number(row!.run), joint: Number(row!.joint), trainee: users.trainee.id });
});

afterAll(async () => {
  await sequelize.query("DELETE FROM run_comments WHERE body = 'matrix comment'");
  await sequelize.close();
});

function actionFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) return name === 'node_modules' ? [] : actionFiles(full);
    return /\.(ts|tsx)$/.test(name) && /^'use server'/m.test(readFileSync(full, 'utf8')) ? [full] : [];
  });
}

describe('server-action role matrix', () => {
  it('has an entry for every exported server action', () => {
    const covered = new Set([...ACTIONS.map((a) => `${a.file}#${a.name}`), ...PUBLIC_ACTIONS]);
    const found = ['app', 'lib', 'components'].flatMap((dir) => actionFiles(path.join(root, dir))).flatMap((file) =>
      [...readFileSync(file, 'utf8').matchAll(/^export (?:async function|const) (\w+)/gm)].map((m) => `${path.relative(root, file)}#${m[1]}`),
    );
    expect(found.length).toBeGreaterThan(10);
    expect(found.filter((key) => !covered.has(key)), 'server actions without a role-matrix entry').toEqual([]);
  });

  for (const entry of ACTIONS) {
    for (const caller of CALLERS) {
      const allowed = entry.allowed.includes(caller);
      it(`${entry.name} ${allowed ? 'lets' : 'refuses'} ${caller}`, async () => {
        signedIn.user = caller === 'anonymous' ? null : users[caller];
        const before = allowed ? null : await everyTableCount();
        const result = await outcome(entry);
        if (process.env.MATRIX_DEBUG) console.log(`[matrix] ${entry.name} as ${caller}: ${result.slice(0, 160)}`);
        if (allowed) {
          expect(result, `allowed caller was refused: ${result}`).not.toMatch(REFUSAL);
        } else {
          expect(result).toMatch(REFUSAL);
          expect(await everyTableCount()).toEqual(before);
        }
      });
    }
  }
});
