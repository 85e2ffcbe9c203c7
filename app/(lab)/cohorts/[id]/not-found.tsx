import Link from 'next/link';

export default function CohortNotFound() {
  return (
    <div className="rounded-card border border-rule bg-panel p-6">
      <h1 className="text-xl font-semibold">Cohort not found</h1>
      <p className="mt-2 text-muted">This cohort does not exist, or it is not one you teach.</p>
      <Link href="/cohorts" className="mt-4 inline-block rounded-md bg-accent px-4 py-2 text-accent-ink">All cohorts</Link>
    </div>
  );
}
