import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { JointForm } from '@/components/joints/joint-form';
import Link from 'next/link';
import { getJoint, JOINT_LIBRARY_ROLES } from '@/lib/data/joints';
import { latestCalibration } from '@/lib/data/calibration';
import { DUE_STATUS_LABEL, dueStatus } from '@/lib/calibration/due-status';
import { requirePageUser } from '@/lib/auth/session';
import { saveJointAction } from '../actions';

export const metadata: Metadata = { title: 'Edit joint' };
export const dynamic = 'force-dynamic';

export default async function EditJointPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageUser(JOINT_LIBRARY_ROLES);
  const id = Number((await params).id);
  if (!Number.isInteger(id) || id < 1) notFound();
  const joint = await getJoint(user, id);
  if (!joint) notFound();
  const calibration = await latestCalibration(user, id);
  const due = dueStatus(calibration?.dueOn ?? null, new Date().toISOString().slice(0, 10));
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-semibold">{joint.name}</h1>
        <p className="text-sm text-muted">{joint.runCount > 0 ? `${joint.runCount} runs are recorded on this joint. Its stud count is fixed; a new target applies to new runs only.` : 'No runs are recorded on this joint yet.'}</p>
        <p className="text-sm">
          Gauge calibration: {calibration ? `${calibration.performedOn}, next due ${calibration.dueOn}` : 'none recorded'} ({DUE_STATUS_LABEL[due]}).{' '}
          <Link href={`/joints/${joint.id}/calibration`} className="underline decoration-rule underline-offset-4">Calibration and history</Link>
        </p>
      </div>
      <JointForm joint={joint} units={user.units} action={saveJointAction.bind(null, joint.id)} />
    </div>
  );
}
