import type { Metadata } from 'next';
import { TokenPage } from '@/components/auth/token-page';

export const metadata: Metadata = { title: 'Choose a new password', referrer: 'no-referrer' };
export const dynamic = 'force-dynamic';

export default async function ResetPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return <TokenPage token={token} purpose="reset" />;
}
