import type { Metadata } from 'next';
import { headers } from 'next/headers';
import { notFound } from 'next/navigation';
import { SavedComparisonView } from '@/components/compare/saved-comparison-view';
import { clientAddress } from '@/lib/auth/auth-options';
import { AppError } from '@/lib/http/errors';
import { reviewedComparison } from '@/lib/data/review-links';

export const metadata: Metadata = { title: 'Comparison for review', robots: { index: false } };
export const dynamic = 'force-dynamic';

/** Public: a saved comparison opened read-only through a review link, trainees pseudonymised; anything else is a plain 404. */
export default async function ReviewPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const answer = await reviewedComparison(token.slice(0, 100), clientAddress(Object.fromEntries(await headers()))).catch((error: unknown) => {
    if (error instanceof AppError && error.code === 'not_found') notFound();
    throw error;
  });
  if (answer.kind === 'rate_limited') {
    return <main className="mx-auto max-w-xl p-6"><p role="alert" className="text-sm">Too many look-ups from your address. Wait 15 minutes, then try again.</p></main>;
  }
  return (
    <main className="mx-auto max-w-6xl p-4 sm:p-6">
      <SavedComparisonView saved={answer.value} packageHref={`/api/review/${token}/package`} review />
    </main>
  );
}
