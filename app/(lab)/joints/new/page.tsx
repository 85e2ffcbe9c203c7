import type { Metadata } from 'next';
import { JointForm } from '@/components/joints/joint-form';
import { JOINT_LIBRARY_ROLES } from '@/lib/data/joints';
import { requirePageUser } from '@/lib/auth/session';
import { saveJointAction } from '../actions';

export const metadata: Metadata = { title: 'New joint' };

export default async function NewJointPage() {
  const user = await requirePageUser(JOINT_LIBRARY_ROLES);
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-semibold">New joint</h1>
        <p className="text-sm text-muted">Describe a training joint: its flange, studs, target stud load and the gauge calibration of each position.</p>
      </div>
      <JointForm units={user.units} action={saveJointAction.bind(null, null)} />
    </div>
  );
}
