import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { SavedComparisonView } from '@/components/compare/saved-comparison-view';
import { requirePageUser } from '@/lib/auth/session';
import { AppError } from '@/lib/http/errors';
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
  const { runs: _runs, ...view } = saved;
  return <SavedComparisonView saved={view} />;
}
