import Link from 'next/link';
import { formatDate } from '@/lib/format/format-date';

/** The researcher's saved comparisons on Home, newest first. */
export function SavedComparisons({ items }: { items: { slug: string; title: string; createdAt: string; runCount: number }[] }) {
  return (
    <section className="rounded-card border border-rule bg-panel p-4" aria-labelledby="saved-heading">
      <h2 id="saved-heading" className="font-semibold">Your saved comparisons</h2>
      {items.length === 0 ? (
        <p className="mt-2 text-sm text-muted">None yet. On <Link className="underline decoration-rule underline-offset-4" href="/compare">Compare</Link>, “Freeze this comparison” keeps its results under a link you can cite.</p>
      ) : (
        <div className="mt-2 relative overflow-x-auto">
        <table className="w-full text-sm">
          <thead className="text-left text-muted"><tr><th className="py-1">Title</th><th>Frozen</th><th className="text-right">Runs</th></tr></thead>
          <tbody className="num">
            {items.map((c) => (
              <tr key={c.slug} className="border-t border-rule">
                <td className="py-1.5"><Link className="underline decoration-rule underline-offset-4" href={`/compare/saved/${c.slug}`}>{c.title}</Link></td>
                <td>{formatDate(c.createdAt)}</td>
                <td className="text-right">{c.runCount}</td>
              </tr>
            ))}
          </tbody>
        </table>
        </div>
      )}
    </section>
  );
}
