import Link from 'next/link';
import { describeToken, PASSWORD_MIN_LENGTH } from '@/lib/data/invitations';
import { AuthCard } from './auth-card';
import { SetPasswordForm } from './set-password-form';

/** The page behind an invitation or reset link: the form, or why the link cannot be used. */
export async function TokenPage({ token, purpose }: { token: string; purpose: 'invite' | 'reset' }) {
  const link = await describeToken(token, purpose);
  if (link.state !== 'valid' || !link.email) {
    return (
      <AuthCard title={purpose === 'invite' ? 'This invitation cannot be used' : 'This reset link cannot be used'}>
        <p role="alert" className="mt-4 text-sm">{link.message}</p>
        <p className="mt-4 text-sm">
          <Link href="/forgot-password" className="underline underline-offset-4">Request a new password-reset link</Link>
        </p>
      </AuthCard>
    );
  }
  return (
    <AuthCard
      title={purpose === 'invite' ? 'Welcome to Evenload' : 'Choose a new password'}
      lead={purpose === 'invite' ? `Set a password to join ${link.cohortName ? `“${link.cohortName}”` : 'your course'}. This link works once.` : 'This link works once.'}
    >
      {/* A new account's placeholder name is the address's local part: ask for the real one. */}
      <SetPasswordForm token={token} purpose={purpose} email={link.email} name={link.name === link.email.split('@')[0] ? null : link.name} minLength={PASSWORD_MIN_LENGTH} />
    </AuthCard>
  );
}
