import Link from 'next/link';

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl px-4 py-16">
      <h1 className="text-2xl font-semibold">Not found</h1>
      <p className="mt-2 text-muted">This page does not exist, or it is not yours to see.</p>
      <Link href="/" className="mt-6 inline-block rounded-md bg-accent px-4 py-2 text-accent-ink">Back to home</Link>
    </main>
  );
}
