import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { FigureHistory } from '@/components/run-report/figure-history';
import { formatDateTime } from '@/lib/format/format-date';
import { RunReport } from '@/components/run-report/run-report';
import { RunTools } from '@/components/run-report/run-tools';
import { listEquipment, runTools } from '@/lib/data/equipment';
import { runFigureHistory } from '@/lib/data/calibration-correction';
import { analyseRun } from '@/lib/analysis/analyse-run';
import { isAppError } from '@/lib/http/errors';
import { runIdSchema } from '@/lib/data/run-params';
import { loadRun } from '@/lib/data/run-report';
import { requirePageUser } from '@/lib/auth/session';
import { runAttempt } from '@/lib/data/qualification/attempts';
import { AttemptPanel } from '@/components/run-report/attempt-panel';
import { AuditHistory } from '@/components/audit/audit-history';
import { REVIEW_ROLES } from '@/lib/data/runs/run-review';
import { addCommentAction, addHoldsAction, confirmAttemptAction, restoreRunAction, reviewRunAction, setAsideAction, setRunToolsAction } from './actions';
import { HOLD_ROLES, loadRunHolds } from '@/lib/data/run-holds';
import { runRelaxation } from '@/lib/analysis/relaxation';
import { studTransfers } from '@/lib/calc/tensioner-coverage';

export const metadata: Metadata = { title: 'Run report' };
export const dynamic = 'force-dynamic';

export default async function RunReportPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageUser();
  const parsed = runIdSchema.safeParse((await params).id);
  if (!parsed.success) notFound();
  const loaded = await loadRun(user, parsed.data).catch((error: unknown) => {
    if (isAppError(error) && error.code === 'not_found') notFound();
    throw error;
  });
  const attempt = await runAttempt(user, parsed.data);
  const analysis = analyseRun(parsed.data, loaded.run, { bandPercent: loaded.header.bandPercent, passPercents: loaded.header.method.passPercents });
  const id = parsed.data;
  const relaxation = runRelaxation(analysis.passes, await loadRunHolds(parsed.data, loaded.run.studCount));
  // Only after loadRun: the run is the viewer's to see.
  const editsTools = user.role === 'instructor' || user.role === 'admin';
  const [history, tools, register] = await Promise.all([runFigureHistory(parsed.data), runTools(user, parsed.data), editsTools ? listEquipment(user) : null]);
  return (
    <div className="space-y-6">
      <RunReport
        header={loaded.header}
        analysis={analysis}
        comments={loaded.comments}
        units={user.units}
        role={user.role}
        attempt={{ kind: attempt.kind, sourceLine: attempt.sourceLine }}
        commentAction={user.role === 'instructor' || user.role === 'admin' ? addCommentAction.bind(null, parsed.data) : null}
        reviewAction={REVIEW_ROLES.includes(user.role) ? reviewRunAction.bind(null, parsed.data) : null}
        setAsideAction={attempt.canSetAside && attempt.status === 'needs_review' ? setAsideAction.bind(null, id) : null}
        relaxation={relaxation}
        holdAction={HOLD_ROLES.includes(user.role) ? addHoldsAction.bind(null, parsed.data) : null}
        transfers={studTransfers(loaded.run)}
        printedOn={formatDateTime(new Date().toISOString())}
      />
      <RunTools tools={tools} register={register} action={editsTools ? setRunToolsAction.bind(null, parsed.data) : null} />
      <FigureHistory entries={history} />
      <AttemptPanel actions={{
        confirm: attempt.canConfirm ? confirmAttemptAction.bind(null, id) : null,
        setAside: attempt.canSetAside && attempt.status === 'complete' ? setAsideAction.bind(null, id) : null,
        restore: attempt.canRestore ? restoreRunAction.bind(null, id) : null,
      }} />
      {user.role === 'instructor' || user.role === 'admin' ? <AuditHistory entries={attempt.history} title="History of this run" /> : null}
    </div>
  );
}
