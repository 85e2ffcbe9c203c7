import type { Metadata } from 'next';
import Link from 'next/link';
import { redirect } from 'next/navigation';
import { AuthCard } from '@/components/auth/auth-card';
import { getSessionUser } from '@/lib/auth/session';
import { SignInForm } from './sign-in-form';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage() {
  if (await getSessionUser()) redirect('/');
  return (
    <AuthCard
      title="Sign in"
      lead="The lab for per-stud load runs on training joints."
      footer={<>No account yet? Your instructor or the centre&apos;s admin sends you an invitation.</>}
    >
      <SignInForm />
      <p className="mt-4 text-sm">
        <Link href="/forgot-password" className="underline underline-offset-4">Forgot password?</Link>
      </p>
    </AuthCard>
  );
}
