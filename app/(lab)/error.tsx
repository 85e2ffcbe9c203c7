'use client';

export default function LabError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  const databaseDown = /database|ECONNREFUSED|Connection/i.test(error.message);
  return (
    <div role="alert" className="rounded-card border border-rule bg-panel p-6">
      <h1 className="text-xl font-semibold">{databaseDown ? 'The database is not answering' : 'This page could not be shown'}</h1>
      <p className="mt-2 text-muted">
        {databaseDown
          ? 'Evenload cannot reach its database just now. Nothing you saved is lost. Try again in a few seconds.'
          : 'Something went wrong while loading this page. Try again; if it keeps happening, tell your admin the time it happened.'}
      </p>
      <button type="button" onClick={reset} className="mt-4 rounded-md bg-accent px-4 py-2 text-accent-ink">Try again</button>
    </div>
  );
}
