import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { CautionBlock } from '@/components/caution-block';
import { CalibrationForm } from '@/components/calibration/calibration-form';
import { CalibrationHistory } from '@/components/calibration/calibration-history';
import { LimitsForm } from '@/components/calibration/limits-form';
import { calibrationHistory, getCalibrationLimits } from '@/lib/data/calibration';
import { getJoint, JOINT_LIBRARY_ROLES } from '@/lib/data/joints';
import { requirePageUser } from '@/lib/auth/session';
import { correctCalibrationAction, recordCalibrationAction, saveLimitsAction } from './actions';

export const metadata: Metadata = { title: 'Gauge calibration' };
export const dynamic = 'force-dynamic';

export default async function CalibrationPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageUser(JOINT_LIBRARY_ROLES);
  const id = Number((await params).id);
  if (!Number.isInteger(id) || id < 1) notFound();
  const joint = await getJoint(user, id);
  if (!joint) notFound();
  const [sessions, limits] = await Promise.all([calibrationHistory(user, id), getCalibrationLimits(user)]);
  const today = new Date().toISOString().slice(0, 10);
  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-2xl font-semibold">Gauge calibration: {joint.name}</h1>
        <p className="text-sm text-muted">
          Each position&apos;s gauge against the reference load cell. <Link href={`/joints/${id}`} className="underline decoration-rule underline-offset-4">Back to the joint</Link>
        </p>
      </div>
      <CautionBlock variant="calibration" />
      <section aria-labelledby="history-heading" className="space-y-3">
        <h2 id="history-heading" className="text-lg font-semibold">History</h2>
        {sessions.length === 0 ? <p className="text-sm text-muted">No calibration is recorded for this joint yet.</p> : <CalibrationHistory sessions={sessions} studCount={joint.studCount} correctActions={Object.fromEntries(sessions.map((s) => [s.id, correctCalibrationAction.bind(null, id, s.id)]))} />}
      </section>
      <section aria-labelledby="new-heading" className="space-y-3">
        <h2 id="new-heading" className="text-lg font-semibold">New calibration</h2>
        <p className="text-sm text-muted">
          Limits in use: linearity {limits.linearityPercent} %, hysteresis {limits.hysteresisPercent} %, zero return {limits.zeroReturnPercent} % of full scale; factor interval ±{limits.intervalPercent} %; every {limits.intervalMonths} months
          {limits.trainingDefault ? ' (training default: set your own)' : ''}.
        </p>
        <CalibrationForm studCount={joint.studCount} action={recordCalibrationAction.bind(null, id)} today={today} />
      </section>
      {user.role === 'admin' ? <LimitsForm limits={limits} action={saveLimitsAction.bind(null, id)} /> : null}
    </div>
  );
}
