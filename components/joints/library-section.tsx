import Link from 'next/link';
import { EmptyState } from '../ui/empty-state';

/** One section of the joint library page: heading, "New …" link, and a table or the empty state. */
export function LibrarySection({
  id,
  title,
  newHref,
  newLabel,
  empty,
  columns,
  children,
}: {
  id: string;
  title: string;
  newHref: string;
  newLabel: string;
  /** Shown instead of the table when there is nothing yet: a title and how to fill it. */
  empty: { title: string; text: string } | null;
  /** Column headings; `right` aligns numbers. */
  columns: { label: string; right?: boolean }[];
  children: React.ReactNode;
}) {
  return (
    <section id={id} aria-labelledby={`${id}-heading`} className="rounded-card border border-rule bg-panel p-4">
      <div className="flex items-center justify-between gap-2">
        <h2 id={`${id}-heading`} className="text-lg font-semibold">{title}</h2>
        <Link href={newHref} className="rounded-md bg-accent px-3 py-1.5 text-sm font-medium text-accent-ink">{newLabel}</Link>
      </div>
      {empty ? (
        <div className="mt-3"><EmptyState title={empty.title}>{empty.text}</EmptyState></div>
      ) : (
        <div className="mt-3 relative overflow-x-auto">
          <table className="w-full text-sm">
            <thead className="bg-rule/40 text-left">
              <tr>
                {columns.map((c) => <th key={c.label} className={`px-3 py-2 ${c.right ? 'text-right' : ''}`}>{c.label}</th>)}
              </tr>
            </thead>
            <tbody className="num">{children}</tbody>
          </table>
        </div>
      )}
    </section>
  );
}
