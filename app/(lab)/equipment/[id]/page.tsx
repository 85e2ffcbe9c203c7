import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { EquipmentForm } from '@/components/equipment/equipment-form';
import { getEquipment } from '@/lib/data/equipment';
import { requirePageUser } from '@/lib/auth/session';
import { saveEquipmentAction } from '../actions';

export const metadata: Metadata = { title: 'Edit equipment' };
export const dynamic = 'force-dynamic';

export default async function EditEquipmentPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageUser(['admin']);
  const id = Number((await params).id);
  if (!Number.isInteger(id) || id < 1) notFound();
  const item = await getEquipment(user, id);
  if (!item) notFound();
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">{item.name}</h1>
      <EquipmentForm item={item} action={saveEquipmentAction.bind(null, item.id)} />
    </div>
  );
}
