import Link from 'next/link';
import { DUE_STATUS_LABEL, dueStatus } from '@/lib/calibration/due-status';
import type { CalibrationDue } from '@/lib/data/calibration';

/** Gauge calibration due dates per joint (admin's home), soonest first. Server-safe. */
export function CalibrationDueDates({ joints, today }: { joints: CalibrationDue[]; today: string }) {
  return (
    <section className="rounded-card border border-rule bg-panel p-4" aria-labelledby="calibration-due">
      <h2 id="calibration-due" className="font-semibold">Gauge calibration due</h2>
      {joints.length === 0 ? (
        <p className="mt-2 text-sm text-muted">No joints in the library yet.</p>
      ) : (
        <table className="mt-2 w-full text-sm">
          <thead className="text-left text-muted"><tr><th className="py-1">Joint</th><th>Next calibration</th><th>Load cell certificate due</th><th>Status</th></tr></thead>
          <tbody className="num">
            {joints.map((j) => {
              const status = dueStatus(j.dueOn, today);
              return (
                <tr key={j.jointId} className="border-t border-rule">
                  <td className="py-1.5"><Link className="underline decoration-rule underline-offset-4" href={`/joints/${j.jointId}/calibration`}>{j.jointName}</Link></td>
                  <td>{j.dueOn ?? '—'}</td>
                  <td>{j.loadCellDueOn ?? '—'}</td>
                  <td className={status === 'overdue' || status === 'never' ? 'font-semibold text-caution' : ''}>{DUE_STATUS_LABEL[status]}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      )}
    </section>
  );
}
