import type { Metadata } from 'next';
import { ClassroomView, type RealRunData } from '@/components/classroom/classroom-view';
import { parseSceneOrder } from '@/lib/classroom/scenes';
import { classroomCohorts, classroomLibrary, classroomRealRuns } from '@/lib/data/classroom';
import { loadRun } from '@/lib/data/run-report';
import { isAppError } from '@/lib/http/errors';
import { requirePageUser } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Classroom' };
export const dynamic = 'force-dynamic';

const one = (value: string | string[] | undefined) => (Array.isArray(value) ? value[0] : value);
const positiveInt = (value: string | undefined) => (value && /^\d+$/.test(value) && Number(value) > 0 ? Number(value) : null);

export default async function ClassroomPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requirePageUser(['instructor']);
  const params = await searchParams;
  const [library, cohorts] = await Promise.all([classroomLibrary(user), classroomCohorts(user)]);
  const realRuns = await classroomRealRuns(user, cohorts);
  const runId = positiveInt(one(params.run)) ?? realRuns.defaultRunId;
  let realRun: RealRunData | null = null;
  if (runId !== null) {
    try {
      const loaded = await loadRun(user, runId);
      // A run without steps has nothing to replay (the scene would have no frames).
      if (loaded.run.steps.length > 0) realRun = { id: loaded.header.id, label: realRuns.runs.find((r) => r.id === runId)?.label ?? `Run ${runId}`, jointId: loaded.header.joint.id, methodId: loaded.header.method.id, lubricantId: loaded.header.lubricant.id, bandPercent: loaded.header.bandPercent, run: loaded.run, gasket: loaded.header.joint.gasket };
    } catch (error) {
      if (!isAppError(error)) throw error;
    }
  }
  return (
    <ClassroomView
      library={library}
      cohorts={cohorts}
      realRuns={realRuns.runs}
      realRun={realRun}
      initialOrder={parseSceneOrder(one(params.scenes))}
      initialJointId={positiveInt(one(params.joint)) ?? library.joints[0]?.id ?? null}
      seed={positiveInt(one(params.seed)) ?? 1}
      units={user.units}
    />
  );
}
