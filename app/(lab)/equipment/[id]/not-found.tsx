import Link from 'next/link';

export default function EquipmentNotFound() {
  return (
    <div className="rounded-card border border-rule bg-panel p-6">
      <h1 className="text-xl font-semibold">There is no such item</h1>
      <p className="mt-2 text-muted">It may have been removed, or the address is mistyped.</p>
      <Link href="/equipment" className="mt-4 inline-block rounded-md bg-accent px-4 py-2 text-accent-ink">Open the equipment register</Link>
    </div>
  );
}
