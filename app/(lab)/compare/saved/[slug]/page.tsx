import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { ReviewLinks } from '@/components/compare/review-links';
import { SavedComparisonView } from '@/components/compare/saved-comparison-view';
import { requirePageUser } from '@/lib/auth/session';
import { AppError } from '@/lib/http/errors';
import { listReviewLinks } from '@/lib/data/review-links';
import { savedComparison } from '@/lib/data/saved-comparisons';

export const metadata: Metadata = { title: 'Saved comparison' };
export const dynamic = 'force-dynamic';

export default async function SavedComparisonPage({ params }: { params: Promise<{ slug: string }> }) {
  const user = await requirePageUser(['instructor', 'researcher']);
  const { slug } = await params;
  const saved = await savedComparison(user, slug).catch((error: unknown) => {
    if (error instanceof AppError && error.code === 'not_found') notFound();
    throw error;
  });
  const { runs: _runs, tables: _tables, ...view } = saved;
  // Only the author makes and withdraws review links (anyone else sees none).
  const links = await listReviewLinks(user, slug).catch(() => null);
  return (
    <SavedComparisonView saved={view} packageHref={`/api/compare/saved/${view.slug}/package`} units={user.units}>
      {links ? <ReviewLinks slug={view.slug} links={links} /> : null}
    </SavedComparisonView>
  );
}
