/**
 * Lines for signatures and dates at the foot of a printed sheet; hidden on screen (`print-only`).
 */
export function PrintSignature({ roles }: { roles: readonly string[] }) {
  return (
    <section className="print-only mt-10 break-inside-avoid" aria-hidden="true">
      <div className="grid grid-cols-2 gap-x-10 gap-y-8 text-sm">
        {roles.map((role) => (
          <div key={role} className="space-y-6">
            <div className="border-b border-black pt-8">{role}: name and signature</div>
            <div className="border-b border-black pt-6">Date</div>
          </div>
        ))}
      </div>
    </section>
  );
}

/** The header of a printed sheet: the centre's app name, what the sheet is and when it was printed. Hidden on screen. */
export function PrintHeader({ title, printedOn }: { title: string; printedOn: string }) {
  return (
    <div className="print-only mb-4 border-b border-black pb-2 text-sm" aria-hidden="true">
      <strong>Evenload</strong> · {title} · printed {printedOn}
    </div>
  );
}
