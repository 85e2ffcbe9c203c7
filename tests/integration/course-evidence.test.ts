import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { Cohort } from '@/models';
import { createCohort } from '@/lib/data/cohorts';
import { signOffRun } from '@/lib/data/assessment';
import { courseEvidenceOf, recordTheoryResult, saveChecklist, setChecklistTick, setTheoryPassMark } from '@/lib/data/qualification/course-evidence';
import { decideCourseOutcome } from '@/lib/data/qualification/course-outcomes';
import { issueTrainingRecord } from '@/lib/data/qualification/training-records';
import { DEFAULT_CHECKLIST } from '@/lib/qualification/course-outcome';
import type { SessionUser } from '@/lib/auth/session';
import { jointTarget, storeFixtureRun } from './run-fixture';
import { count, demoPeople, removeCohortAndEvidence } from './support';

// Issue 17 item 3: the theory result against the cohort's pass mark, the observation checklist and
// the rule for a pass with something outstanding (an override reason, stored and audited, or refused).
const stamp = Date.now().toString(36);
let instructor: SessionUser;
let otherInstructor: SessionUser;
let trainee: SessionUser;
let cohortId: number;

const evidenceRows = async () => ({
  theory: await count('SELECT COUNT(*) AS n FROM theory_results WHERE cohort_id = ?', [cohortId]),
  items: await count('SELECT COUNT(*) AS n FROM checklist_items WHERE cohort_id = ?', [cohortId]),
  ticks: await count('SELECT COUNT(*) AS n FROM checklist_ticks t JOIN checklist_items i ON i.id = t.item_id WHERE i.cohort_id = ?', [cohortId]),
  outcomes: await count('SELECT COUNT(*) AS n FROM course_outcomes WHERE cohort_id = ?', [cohortId]),
  audit: await count('SELECT COUNT(*) AS n FROM audit_log'),
  passMark: await count('SELECT COALESCE(theory_pass_mark, -1) AS n FROM cohorts WHERE id = ?', [cohortId]),
});

const lastAudit = async (objectType: string, objectId: number) =>
  (await sequelize.query<{ actor_id: number; action: string; reason: string | null; before_json: string | null; after_json: string | null }>(
    'SELECT actor_id, action, reason, before_json, after_json FROM audit_log WHERE object_type = ? AND object_id = ? ORDER BY id DESC LIMIT 1',
    { type: QueryTypes.SELECT, replacements: [objectType, objectId] },
  ))[0]!;
const json = (text: string | null) => (text === null ? null : (JSON.parse(text) as unknown));
const evidence = async () => courseEvidenceOf((await Cohort.findByPk(cohortId))!, trainee.id);

beforeAll(async () => {
  ({ instructor, otherInstructor, trainee } = await demoPeople());
  cohortId = await createCohort(instructor, { name: `Evidence ${stamp}`, site: 'Test bay (invented)', startsOn: '2026-12-01', endsOn: '2026-12-05' });
  await sequelize.query('INSERT INTO cohort_members (cohort_id, user_id, created_at) VALUES (?, ?, NOW())', { replacements: [cohortId, trainee.id] });
});

afterAll(async () => {
  await removeCohortAndEvidence(cohortId);
  await sequelize.close();
});

describe('course evidence', () => {
  it('refuses bad input at the boundary and changes no row', async () => {
    const before = await evidenceRows();
    // Each refusal is started only when awaited, so none is left rejected while an earlier one is checked.
    const refusals = [
      () => setTheoryPassMark(instructor, cohortId, { passMark: 'seventy' }),
      () => setTheoryPassMark(instructor, cohortId, { passMark: '101' }),
      () => setTheoryPassMark(instructor, cohortId, { passMark: '70.5' }),
      () => recordTheoryResult(instructor, cohortId, trainee.id, { score: 'x', takenOn: '2026-12-02' }, 0),
      () => recordTheoryResult(instructor, cohortId, trainee.id, { score: '100.5', takenOn: '2026-12-02' }, 0),
      () => recordTheoryResult(instructor, cohortId, trainee.id, { score: '72.25', takenOn: '2026-12-02' }, 0),
      () => recordTheoryResult(instructor, cohortId, trainee.id, { score: '72', takenOn: '2026-02-30' }, 0),
      () => saveChecklist(instructor, cohortId, { items: [], added: [] }),
      () => saveChecklist(instructor, cohortId, { items: [], added: ['ab'] }),
      () => setChecklistTick(instructor, cohortId, trainee.id, { itemId: 'none', observed: true, note: '' }, 0),
    ];
    for (const refusal of refusals) await expect(refusal()).rejects.toMatchObject({ code: 'invalid_input' });
    await expect(setTheoryPassMark(trainee, cohortId, { passMark: '70' })).rejects.toMatchObject({ code: 'forbidden' });
    await expect(recordTheoryResult(otherInstructor, cohortId, trainee.id, { score: '80', takenOn: '2026-12-02' }, 0)).rejects.toMatchObject({ code: 'not_found' });
    expect(await evidenceRows()).toEqual(before);
  });

  it('passes a theory score exactly at the pass mark (score ≥ mark) and audits the mark and the result with who, before and after', async () => {
    expect(await evidence()).toMatchObject({ passMark: 70, passMarkIsDefault: true, theory: null });
    await setTheoryPassMark(instructor, cohortId, { passMark: '72' });
    const mark = await lastAudit('criteria', cohortId);
    expect(mark).toMatchObject({ actor_id: instructor.id, action: 'theory_pass_mark' });
    expect(json(mark.before_json)).toEqual({ theoryPassMark: null, effective: 70 });
    expect(json(mark.after_json)).toEqual({ theoryPassMark: 72, effective: 72 });

    // The rule stated in lib/qualification/course-outcome.ts: 72 against 72 passes, 71.9 does not.
    const first = await recordTheoryResult(instructor, cohortId, trainee.id, { score: '71,9', takenOn: '2026-12-02' }, 0);
    expect(first).toMatchObject({ scorePercent: 71.9, passed: false, enteredByName: instructor.name });
    expect((await evidence()).outstanding).toContain('The theory result (71.9 %) is below the pass mark (72 %).');
    const second = await recordTheoryResult(instructor, cohortId, trainee.id, { score: '72', takenOn: '2026-12-03' }, first.version);
    expect(second).toMatchObject({ id: first.id, scorePercent: 72, passed: true });
    const entry = await lastAudit('theory_result', second.id);
    expect(entry).toMatchObject({ actor_id: instructor.id, action: 'update' });
    expect(json(entry.before_json)).toMatchObject({ scorePercent: 71.9, takenOn: '2026-12-02' });
    expect(json(entry.after_json)).toMatchObject({ scorePercent: 72, takenOn: '2026-12-03', passMark: 72, passed: true });
    expect((await evidence()).outstanding.some((o) => o.includes('theory'))).toBe(false);
  });

  it('keeps ticks when items are renamed or retired, and refuses ticks on retired items', async () => {
    await saveChecklist(instructor, cohortId, { items: [], added: [...DEFAULT_CHECKLIST] });
    const items = (await evidence()).checklist;
    expect(items.map((i) => i.label)).toEqual([...DEFAULT_CHECKLIST]);
    const [surface, lubrication] = items;
    const tick = await setChecklistTick(instructor, cohortId, trainee.id, { itemId: String(surface!.id), observed: true, note: 'Threads brushed and checked' }, 0);
    await setChecklistTick(instructor, cohortId, trainee.id, { itemId: String(lubrication!.id), observed: true, note: '' }, 0);
    const tickAudit = await lastAudit('checklist_tick', tick.id);
    expect(tickAudit).toMatchObject({ actor_id: instructor.id, action: 'tick' });
    expect(json(tickAudit.before_json)).toBeNull();
    expect(json(tickAudit.after_json)).toMatchObject({ item: 'Surface and thread preparation', observed: true, note: 'Threads brushed and checked' });
    const ticksBefore = (await evidenceRows()).ticks;

    // Retire the ticked first item, rename the second, keep the rest.
    const edit = items.map((i) => ({ id: i.id, label: i.id === lubrication!.id ? 'Lubrication of threads and nut faces' : i.label, retire: i.id === surface!.id }));
    await saveChecklist(instructor, cohortId, { items: edit, added: ['Torque wrench setting read back'] });
    expect((await evidenceRows()).ticks).toBe(ticksBefore);
    const after = await evidence();
    const retired = after.checklist.find((i) => i.id === surface!.id);
    expect(retired).toMatchObject({ retired: true, tick: { observed: true, note: 'Threads brushed and checked' } });
    expect(after.checklist.find((i) => i.id === lubrication!.id)).toMatchObject({ label: 'Lubrication of threads and nut faces', retired: false, tick: { observed: true } });
    expect(after.checklist.filter((i) => !i.retired)).toHaveLength(5);
    const listAudit = await lastAudit('criteria', cohortId);
    expect(listAudit).toMatchObject({ actor_id: instructor.id, action: 'checklist' });
    expect((json(listAudit.before_json) as { items: unknown[] }).items).toHaveLength(5);
    expect(json(listAudit.after_json)).toMatchObject({ retired: [surface!.id] });

    const rows = await evidenceRows();
    await expect(setChecklistTick(instructor, cohortId, trainee.id, { itemId: String(surface!.id), observed: false, note: '' }, tick.version)).rejects.toMatchObject({ code: 'conflict' });
    // A stale form naming the retired item changes nothing either.
    await expect(saveChecklist(instructor, cohortId, { items: [{ id: surface!.id, label: 'Surface', retire: false }], added: [] })).rejects.toMatchObject({ code: 'conflict' });
    expect(await evidenceRows()).toEqual(rows);
  });

  it('refuses a pass with anything outstanding unless an override reason is given, which is stored and audited; records only on a pass', async () => {
    const outstanding = (await evidence()).outstanding;
    expect(outstanding).toContain('No signed-off assessed attempt meets every criterion.');
    const before = await evidenceRows();
    await expect(decideCourseOutcome(instructor, cohortId, trainee.id, { decision: 'pass', scopes: ['Hand torque'] }, 0)).rejects.toMatchObject({
      code: 'invalid_input',
      message: expect.stringContaining('Not yet observed'),
      details: { fieldErrors: { overrideReason: [expect.stringContaining('reason')] } },
    });
    await expect(decideCourseOutcome(instructor, cohortId, trainee.id, { decision: 'pass', scopes: ['Hand torque'], overrideReason: '  ' }, 0)).rejects.toMatchObject({ code: 'invalid_input' });
    expect(await evidenceRows()).toEqual(before);
    await expect(issueTrainingRecord(instructor, cohortId, trainee.id)).rejects.toMatchObject({ code: 'invalid_input' });

    const reason = 'Practical observed at the previous course; items confirmed by phone (test)';
    const passed = await decideCourseOutcome(instructor, cohortId, trainee.id, { decision: 'pass', scopes: ['Hand torque'], overrideReason: reason }, 0);
    expect(passed).toMatchObject({ decision: 'pass', overrideReason: reason });
    const entry = await lastAudit('course_outcome', passed.id);
    expect(entry).toMatchObject({ actor_id: instructor.id, action: 'pass_override', reason });
    expect(json(entry.before_json)).toBeNull();
    expect(json(entry.after_json)).toMatchObject({ decision: 'pass', overrideReason: reason, outstanding });

    // Not yet needs no reason, and clears the override.
    const notYet = await decideCourseOutcome(instructor, cohortId, trainee.id, { decision: 'not_yet', scopes: [] }, passed.version);
    expect(notYet.overrideReason).toBeNull();
    expect(json((await lastAudit('course_outcome', passed.id)).before_json)).toMatchObject({ decision: 'pass', overrideReason: reason });
    await expect(issueTrainingRecord(instructor, cohortId, trainee.id)).rejects.toMatchObject({ code: 'invalid_input' });

    // With everything in place a pass needs no reason: a witnessed attempt signed off with every criterion met, every item observed.
    const target = await jointTarget();
    const even = await storeFixtureRun({ operatorId: trainee.id, cohortId, finalLoadsN: Array.from({ length: 8 }, () => target), recordedById: instructor.id });
    // Every stud exactly at the target: inside any band, CV 0 (computed), so every default criterion is met.
    expect(await signOffRun(instructor, even, 'Even at the target')).toMatchObject({ allMet: true });
    for (const item of (await evidence()).checklist.filter((i) => !i.retired && !i.tick?.observed)) {
      await setChecklistTick(instructor, cohortId, trainee.id, { itemId: String(item.id), observed: true, note: '' }, item.tick?.version ?? 0);
    }
    expect((await evidence()).outstanding).toEqual([]);
    const clean = await decideCourseOutcome(instructor, cohortId, trainee.id, { decision: 'pass', scopes: ['Hand torque'] }, notYet.version);
    expect(clean.overrideReason).toBeNull();
    expect((await lastAudit('course_outcome', clean.id)).action).toBe('update');
    await expect(issueTrainingRecord(instructor, cohortId, trainee.id)).resolves.toMatchObject({ status: 'valid' });
  });
});
