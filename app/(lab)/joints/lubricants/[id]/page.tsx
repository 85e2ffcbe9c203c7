import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { LubricantForm } from '@/components/joints/lubricant-form';
import { getLubricant, JOINT_LIBRARY_ROLES } from '@/lib/data/joints';
import { requirePageUser } from '@/lib/auth/session';
import { saveLubricantAction } from '../../actions';

export const metadata: Metadata = { title: 'Edit lubricant' };
export const dynamic = 'force-dynamic';

export default async function EditLubricantPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageUser(JOINT_LIBRARY_ROLES);
  const id = Number((await params).id);
  if (!Number.isInteger(id) || id < 1) notFound();
  const lubricant = await getLubricant(user, id);
  if (!lubricant) notFound();
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">{lubricant.name}</h1>
      {lubricant.runCount > 0 ? <p className="text-sm text-muted">{lubricant.runCount} runs used this lubricant; changing its name or K changes how they are labelled in comparisons.</p> : null}
      <LubricantForm lubricant={lubricant} action={saveLubricantAction.bind(null, lubricant.id)} />
    </div>
  );
}
