import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { FigureHistory } from '@/components/run-report/figure-history';
import { RunReport } from '@/components/run-report/run-report';
import { RunTools } from '@/components/run-report/run-tools';
import { listEquipment, runTools } from '@/lib/data/equipment';
import { runFigureHistory } from '@/lib/data/calibration-correction';
import { analyseRun } from '@/lib/analysis/analyse-run';
import { isAppError } from '@/lib/http/errors';
import { runIdSchema } from '@/lib/data/run-params';
import { loadRun } from '@/lib/data/run-report';
import { requirePageUser } from '@/lib/auth/session';
import { addCommentAction, setRunToolsAction } from './actions';

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
  const analysis = analyseRun(parsed.data, loaded.run, { bandPercent: loaded.header.bandPercent, passPercents: loaded.header.method.passPercents });
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
        commentAction={user.role === 'instructor' || user.role === 'admin' ? addCommentAction.bind(null, parsed.data) : null}
      />
      <RunTools tools={tools} register={register} action={editsTools ? setRunToolsAction.bind(null, parsed.data) : null} />
      <FigureHistory entries={history} />
    </div>
  );
}
