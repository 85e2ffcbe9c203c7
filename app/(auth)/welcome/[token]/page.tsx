import type { Metadata } from 'next';
import { TokenPage } from '@/components/auth/token-page';

export const metadata: Metadata = { title: 'Welcome', referrer: 'no-referrer' };
export const dynamic = 'force-dynamic';

export default async function WelcomePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return <TokenPage token={token} purpose="invite" />;
}
