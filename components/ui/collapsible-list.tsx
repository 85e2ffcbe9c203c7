import Link from 'next/link';

/** Items per page of a long list on a page (verdicts awaiting, signed off, members). */
export const LIST_PAGE_SIZE = 10;

/** The slice of `items` on `page` (1-based, clamped), and the page count. */
export function pageOf<T>(items: readonly T[], page: number, size = LIST_PAGE_SIZE): { shown: T[]; page: number; pages: number } {
  const pages = Math.max(1, Math.ceil(items.length / size));
  const current = Math.min(Math.max(1, Math.trunc(page) || 1), pages);
  return { shown: items.slice((current - 1) * size, current * size), page: current, pages };
}

/**
 * A long list folded under its heading with its count ("Runs awaiting a verdict (23)"), closed
 * unless `open`; with more than one page, Previous/Next links that set `param` in the address (so
 * Back returns to the previous page) and keep the list open.
 */
export function CollapsibleList({ id, title, count, summary, open, param, page, pages, hrefFor, children }: {
  id: string;
  title: string;
  count: number;
  summary?: string;
  open: boolean;
  param: string;
  page: number;
  pages: number;
  hrefFor: (param: string, page: number) => string;
  children: React.ReactNode;
}) {
  return (
    <details id={id} open={open} className="group rounded-card border border-rule bg-panel">
      <summary className="cursor-pointer list-inside px-4 py-3">
        <h2 className="inline text-lg font-semibold">{title} <span className="num">({count})</span></h2>
        {summary ? <span className="ml-2 text-sm text-muted">{summary}</span> : null}
      </summary>
      <div className="space-y-3 border-t border-rule p-4">
        {children}
        {pages > 1 ? (
          <nav aria-label={`${title}: pages`} className="flex items-center gap-3 text-sm">
            {page > 1 ? <Link href={hrefFor(param, page - 1)} className="rounded-md border border-rule px-3 py-1.5">Previous</Link> : null}
            <span className="num">Page {page} of {pages}</span>
            {page < pages ? <Link href={hrefFor(param, page + 1)} className="rounded-md border border-rule px-3 py-1.5">Next</Link> : null}
          </nav>
        ) : null}
      </div>
    </details>
  );
}
