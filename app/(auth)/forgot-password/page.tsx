import type { Metadata } from 'next';
import { AuthCard } from '@/components/auth/auth-card';
import { ForgotPasswordForm } from '@/components/auth/forgot-password-form';

export const metadata: Metadata = { title: 'Forgot password' };

export default function ForgotPasswordPage() {
  return (
    <AuthCard title="Forgot your password?" lead="Enter the e-mail address of your account and we send it a link to choose a new password.">
      <ForgotPasswordForm />
    </AuthCard>
  );
}
