import type { Metadata } from 'next';
import { LubricantForm } from '@/components/joints/lubricant-form';
import { JOINT_LIBRARY_ROLES } from '@/lib/data/joints';
import { requirePageUser } from '@/lib/auth/session';
import { saveLubricantAction } from '../../actions';

export const metadata: Metadata = { title: 'New lubricant' };

export default async function NewLubricantPage() {
  await requirePageUser(JOINT_LIBRARY_ROLES);
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">New lubricant</h1>
      <LubricantForm action={saveLubricantAction.bind(null, null)} />
    </div>
  );
}
