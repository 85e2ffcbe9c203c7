import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { createCohort } from '@/lib/data/cohorts';
import { recordTheoryResult, saveChecklist, setChecklistTick } from '@/lib/data/qualification/course-evidence';
import { STALE_EDIT_MESSAGE } from '@/lib/data/optimistic-lock';
import { formStateFromError } from '@/lib/http/form-error';
import type { SessionUser } from '@/lib/auth/session';
import { demoPeople, removeCohortAndEvidence } from './support';

// Two people saving one trainee's theory result or one checklist tick from forms opened at the same
// version: the lock (lib/data/optimistic-lock.ts, as for joints and course outcomes) lets exactly one
// save through; the other answers `conflict`, writes nothing, and the audit log holds the save that stood.
const stamp = Date.now().toString(36);
let instructor: SessionUser;
let admin: SessionUser;
let trainee: SessionUser;
let cohortId: number;

type AuditRow = { actor_id: number; action: string; after_json: string };
const auditOf = (objectType: string, objectId: number) =>
  sequelize.query<AuditRow>('SELECT actor_id, action, after_json FROM audit_log WHERE object_type = ? AND object_id = ? ORDER BY id', {
    type: QueryTypes.SELECT,
    replacements: [objectType, objectId],
  });

/** Runs both saves at once and splits them into the one that stood and the one refused. */
async function race<T>(saves: [Promise<T>, Promise<T>]) {
  const settled = await Promise.allSettled(saves);
  const won = settled.flatMap((s, i) => (s.status === 'fulfilled' ? [{ index: i, value: s.value }] : []));
  const lost = settled.flatMap((s) => (s.status === 'rejected' ? [s.reason as unknown] : []));
  return { won, lost };
}

beforeAll(async () => {
  ({ instructor, admin, trainee } = await demoPeople());
  cohortId = await createCohort(instructor, { name: `Evidence lock ${stamp}`, site: 'Test bay (invented)', startsOn: '2026-12-01', endsOn: '2026-12-05' });
  await sequelize.query('INSERT INTO cohort_members (cohort_id, user_id, created_at) VALUES (?, ?, NOW())', { replacements: [cohortId, trainee.id] });
});

afterAll(async () => {
  await removeCohortAndEvidence(cohortId);
  await sequelize.close();
});

describe('optimistic lock on the course evidence', () => {
  it('lets one of two simultaneous theory saves from the same version through; the other is refused and the audit keeps the one that stood', async () => {
    const first = await recordTheoryResult(instructor, cohortId, trainee.id, { score: '60', takenOn: '2026-12-02' }, 0);
    expect(first.version).toBe(1);
    const scores = ['74.5', '81'];
    const { won, lost } = await race([
      recordTheoryResult(instructor, cohortId, trainee.id, { score: scores[0], takenOn: '2026-12-03' }, first.version),
      recordTheoryResult(admin, cohortId, trainee.id, { score: scores[1], takenOn: '2026-12-04' }, first.version),
    ]);
    expect(won).toHaveLength(1);
    expect(lost).toHaveLength(1);
    expect(lost[0]).toMatchObject({ code: 'conflict', message: STALE_EDIT_MESSAGE });
    // The person sees the message in words on the form (never a field named "version").
    expect(formStateFromError(lost[0])).toMatchObject({ status: 'error', message: STALE_EDIT_MESSAGE });
    expect(formStateFromError(lost[0]).fieldErrors).toBeUndefined();

    const winner = won[0]!;
    const stored = await sequelize.query<{ score_percent: string; taken_on: string; entered_by_id: number; version: number }>(
      'SELECT score_percent, taken_on, entered_by_id, version FROM theory_results WHERE cohort_id = ? AND user_id = ?',
      { type: QueryTypes.SELECT, replacements: [cohortId, trainee.id] },
    );
    expect(stored).toHaveLength(1);
    expect(Number(stored[0]!.score_percent)).toBe(Number(scores[winner.index]));
    expect(stored[0]!.entered_by_id).toBe([instructor, admin][winner.index]!.id);
    expect(stored[0]!.version).toBe(2);

    const audit = await auditOf('theory_result', first.id);
    expect(audit.map((a) => a.action)).toEqual(['create', 'update']);
    expect(audit[1]!.actor_id).toBe([instructor, admin][winner.index]!.id);
    expect(JSON.parse(audit[1]!.after_json)).toMatchObject({ scorePercent: Number(scores[winner.index]) });

    // The refused person reloads (version 2) and saves: now it goes through.
    const again = await recordTheoryResult(instructor, cohortId, trainee.id, { score: '90', takenOn: '2026-12-05' }, 2);
    expect(again).toMatchObject({ scorePercent: 90, version: 3 });
    // A form without a version (opened before the lock existed) is refused, not guessed.
    await expect(recordTheoryResult(instructor, cohortId, trainee.id, { score: '10', takenOn: '2026-12-05' }, null)).rejects.toMatchObject({ code: 'conflict' });
  });

  it('treats the first tick of an item the same way: two forms opened with no tick give one tick and one conflict', async () => {
    await saveChecklist(instructor, cohortId, { items: [], added: ['Flange faces inspected'] });
    const [item] = await sequelize.query<{ id: number }>('SELECT id FROM checklist_items WHERE cohort_id = ?', { type: QueryTypes.SELECT, replacements: [cohortId] });
    const notes = ['Seen by the instructor', 'Seen by the admin'];
    const { won, lost } = await race([
      setChecklistTick(instructor, cohortId, trainee.id, { itemId: String(item!.id), observed: true, note: notes[0] }, 0),
      setChecklistTick(admin, cohortId, trainee.id, { itemId: String(item!.id), observed: true, note: notes[1] }, 0),
    ]);
    expect(won).toHaveLength(1);
    expect(lost).toHaveLength(1);
    expect(lost[0]).toMatchObject({ code: 'conflict', message: STALE_EDIT_MESSAGE });
    const winner = won[0]!;
    const ticks = await sequelize.query<{ id: number; note: string; observed_by_id: number; version: number }>(
      'SELECT id, note, observed_by_id, version FROM checklist_ticks WHERE item_id = ? AND user_id = ?',
      { type: QueryTypes.SELECT, replacements: [item!.id, trainee.id] },
    );
    expect(ticks).toEqual([{ id: winner.value.id, note: notes[winner.index], observed_by_id: [instructor, admin][winner.index]!.id, version: 1 }]);
    const audit = await auditOf('checklist_tick', winner.value.id);
    expect(audit).toHaveLength(1);
    expect(JSON.parse(audit[0]!.after_json)).toMatchObject({ note: notes[winner.index], observed: true });

    // Un-ticking from the stale form (version 0) changes nothing; from the current one it goes through.
    await expect(setChecklistTick(instructor, cohortId, trainee.id, { itemId: String(item!.id), observed: false, note: '' }, 0)).rejects.toMatchObject({ code: 'conflict' });
    await expect(setChecklistTick(instructor, cohortId, trainee.id, { itemId: String(item!.id), observed: false, note: '' }, 1)).resolves.toMatchObject({ observed: false, version: 2 });
  });
});
