import Link from 'next/link';
import { DUE_STATUS_LABEL, dueStatus } from '@/lib/calibration/due-status';
import { EQUIPMENT_KIND_LABELS } from '@/lib/equipment/equipment-kinds';
import type { EquipmentItem } from '@/lib/data/equipment';

/** The register as a table with each item's due status on `today`; names link to the edit page when `editable`. Server-safe. */
export function EquipmentTable({ items, today, editable, caption }: { items: EquipmentItem[]; today: string; editable: boolean; caption: string }) {
  if (items.length === 0) return <p className="text-sm text-muted">Nothing in the register yet.</p>;
  return (
    <table className="w-full text-sm">
      <caption className="text-left font-semibold">{caption}</caption>
      <thead className="text-left text-muted"><tr><th className="py-1">Item</th><th>Kind</th><th>Serial</th><th>Certificate</th><th>Due</th><th>Status</th></tr></thead>
      <tbody className="num">
        {items.map((e) => {
          const status = e.inService ? dueStatus(e.dueOn, today) : null;
          return (
            <tr key={e.id} className="border-t border-rule">
              <td className="py-1.5">{editable ? <Link className="underline decoration-rule underline-offset-4" href={`/equipment/${e.id}`}>{e.name}</Link> : e.name}</td>
              <td>{EQUIPMENT_KIND_LABELS[e.kind]}</td>
              <td>{e.serialNumber}</td>
              <td>{e.certificate ?? '—'}</td>
              <td>{e.dueOn ?? '—'}</td>
              <td className={status === 'overdue' || status === 'never' ? 'font-semibold text-caution' : ''}>{status ? DUE_STATUS_LABEL[status] : 'out of service'}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
