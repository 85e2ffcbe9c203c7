import Link from 'next/link';

export default function RunNotFound() {
  return (
    <div className="rounded-card border border-rule bg-panel p-6">
      <h1 className="text-xl font-semibold">Run not found</h1>
      <p className="mt-2 text-muted">This run does not exist, or it is not yours to see.</p>
      <Link href="/runs" className="mt-4 inline-block rounded-md bg-accent px-4 py-2 text-accent-ink">Back to runs</Link>
    </div>
  );
}
