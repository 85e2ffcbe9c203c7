import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '@/models';
import { AppError } from '@/lib/http/errors';
import { studYieldLoad } from '@/lib/joints/joint-properties';
import { checkRun } from '@/lib/run-check/check-run';
import type { RunCheckReason } from '@/lib/run-check/types';
import type { NormalisedRun } from '@/lib/record/run-types';
import type { MethodPass, TensionerCoverage } from '@/models/method';

export interface CheckedStatus {
  status: 'complete' | 'needs_review';
  /** The reasons as stored in `runs.review_reasons`; null when the run passed. */
  reasonsJson: string | null;
  reasons: RunCheckReason[];
}

/**
 * The run check of lib/run-check against the run's joint and method as they are in the database,
 * read inside the storing transaction. Called from store-run.ts only, where every way in (upload,
 * hand entry, the live stream when it is finished, simulate) stores its run. No `server-only`
 * import: the demo seeder and the bench store runs through store-run.ts outside Next.
 */
export async function checkBeforeStoring(ids: { jointId: number; methodId: number; bandPercent: number }, run: NormalisedRun, transaction: Transaction): Promise<CheckedStatus> {
  const [joints, methods] = await Promise.all([
    sequelize.query<{ stud_count: number; stud_grade: string; thread_system: 'inch' | 'metric'; thread_diameter: number; thread_pitch: number; target_load_n: number }>(
      'SELECT stud_count, stud_grade, thread_system, thread_diameter, thread_pitch, target_load_n FROM joints WHERE id = ?',
      { type: QueryTypes.SELECT, transaction, replacements: [ids.jointId] },
    ),
    sequelize.query<{ name: string; passes: string | MethodPass[]; check_passes: number; tensioner_coverage: TensionerCoverage }>('SELECT name, passes, check_passes, tensioner_coverage FROM methods WHERE id = ?', {
      type: QueryTypes.SELECT,
      transaction,
      replacements: [ids.methodId],
    }),
  ]);
  const joint = joints[0];
  const method = methods[0];
  if (!joint || !method) throw new AppError('not_found', 'The joint or method of this run no longer exists.');
  const reasons = checkRun({
    run,
    jointStudCount: Number(joint.stud_count),
    method: { name: method.name, passes: typeof method.passes === 'string' ? (JSON.parse(method.passes) as MethodPass[]) : method.passes, checkPasses: Number(method.check_passes), tensionerCoverage: method.tensioner_coverage },
    bandPercent: ids.bandPercent,
    yieldLoad: studYieldLoad({
      studGrade: joint.stud_grade,
      threadSystem: joint.thread_system,
      threadDiameter: Number(joint.thread_diameter),
      threadPitch: Number(joint.thread_pitch),
      targetLoadN: Number(joint.target_load_n),
    }),
  });
  return reasons.length ? { status: 'needs_review', reasonsJson: JSON.stringify(reasons), reasons } : { status: 'complete', reasonsJson: null, reasons };
}
