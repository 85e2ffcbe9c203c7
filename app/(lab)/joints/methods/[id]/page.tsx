import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { MethodForm } from '@/components/joints/method-form';
import { getMethod, JOINT_LIBRARY_ROLES, libraryStudCounts } from '@/lib/data/joints';
import { requirePageUser } from '@/lib/auth/session';
import { saveMethodAction } from '../../actions';

export const metadata: Metadata = { title: 'Edit method' };
export const dynamic = 'force-dynamic';

export default async function EditMethodPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageUser(JOINT_LIBRARY_ROLES);
  const id = Number((await params).id);
  if (!Number.isInteger(id) || id < 1) notFound();
  const [method, studCounts] = await Promise.all([getMethod(user, id), libraryStudCounts(user)]);
  if (!method) notFound();
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">{method.name}</h1>
      <MethodForm method={method} studCounts={studCounts} action={saveMethodAction.bind(null, method.id)} />
    </div>
  );
}
