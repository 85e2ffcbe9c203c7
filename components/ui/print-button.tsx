'use client';

export function PrintButton({ label = 'Print this sheet' }: { label?: string }) {
  return (
    <button type="button" onClick={() => window.print()} className="no-print rounded-md border border-rule px-3 py-1.5 text-sm hover:bg-rule/60">
      {label}
    </button>
  );
}
