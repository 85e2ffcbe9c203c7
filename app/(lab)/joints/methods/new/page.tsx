import type { Metadata } from 'next';
import { MethodForm } from '@/components/joints/method-form';
import { JOINT_LIBRARY_ROLES, libraryStudCounts } from '@/lib/data/joints';
import { requirePageUser } from '@/lib/auth/session';
import { saveMethodAction } from '../../actions';

export const metadata: Metadata = { title: 'New method' };
export const dynamic = 'force-dynamic';

export default async function NewMethodPage() {
  const user = await requirePageUser(JOINT_LIBRARY_ROLES);
  const studCounts = await libraryStudCounts(user);
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-semibold">New method</h1>
        <p className="text-sm text-muted">Passes at a % of target, each with the stud order for every stud count of the joints in the library.</p>
      </div>
      <MethodForm studCounts={studCounts} action={saveMethodAction.bind(null, null)} />
    </div>
  );
}
