import type { Metadata } from 'next';
import Link from 'next/link';
import { redirect } from 'next/navigation';
import { Wordmark } from '@/components/shell/wordmark';
import { getSessionUser } from '@/lib/session';
import { SignInForm } from './sign-in-form';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage() {
  if (await getSessionUser()) redirect('/');
  return (
    <main className="grid min-h-screen place-items-center px-4">
      <div className="w-full max-w-sm">
        <div className="mb-8 text-2xl text-ink">
          <Wordmark size={36} />
        </div>
        <div className="rounded-card border border-rule bg-panel p-6 shadow-sm">
          <h1 className="text-xl font-semibold">Sign in</h1>
          <p className="mt-1 text-sm text-muted">The lab for per-stud load runs on training joints.</p>
          <SignInForm />
          <p className="mt-4 text-sm">
            <Link href="/forgot-password" className="underline underline-offset-4">Forgot password?</Link>
          </p>
        </div>
        <p className="mt-6 text-xs text-muted">
          No account yet? Your instructor or the centre&apos;s admin sends you an invitation.
        </p>
      </div>
    </main>
  );
}
