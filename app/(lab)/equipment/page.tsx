import type { Metadata } from 'next';
import { CautionBlock } from '@/components/caution-block';
import { EquipmentForm } from '@/components/equipment/equipment-form';
import { EquipmentTable } from '@/components/equipment/equipment-due';
import { listEquipment } from '@/lib/data/equipment';
import { requirePageUser } from '@/lib/auth/session';
import { saveEquipmentAction } from './actions';

export const metadata: Metadata = { title: 'Equipment' };
export const dynamic = 'force-dynamic';

export default async function EquipmentPage({ searchParams }: { searchParams: Promise<{ saved?: string }> }) {
  const user = await requirePageUser(['admin']);
  const { saved } = await searchParams;
  const items = await listEquipment(user);
  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-2xl font-semibold">Equipment</h1>
        <p className="text-sm text-muted">Torque wrenches, tensioner pumps and their gauges, load cells and loggers, with their calibration and due dates.</p>
      </div>
      {saved ? <p role="status" className="text-sm">Saved.</p> : null}
      <CautionBlock variant="calibration" />
      <section className="rounded-card border border-rule bg-panel p-4">
        <EquipmentTable items={items} today={new Date().toISOString().slice(0, 10)} editable caption="Register" />
      </section>
      <section aria-labelledby="new-equipment" className="space-y-3">
        <h2 id="new-equipment" className="text-lg font-semibold">Add an item</h2>
        <EquipmentForm item={null} action={saveEquipmentAction.bind(null, null)} />
      </section>
    </div>
  );
}
