import Link from 'next/link';
import { Wordmark } from '../shell/wordmark';

/** The centred card the sign-in, welcome and reset pages share. */
export function AuthCard({ title, lead, children, footer }: { title: string; lead?: string; children: React.ReactNode; footer?: React.ReactNode }) {
  return (
    <main className="grid min-h-screen place-items-center px-4">
      <div className="w-full max-w-sm">
        <div className="mb-8 text-2xl text-ink">
          <Wordmark size={36} />
        </div>
        <div className="rounded-card border border-rule bg-panel p-6 shadow-sm">
          <h1 className="text-xl font-semibold">{title}</h1>
          {lead ? <p className="mt-1 text-sm text-muted">{lead}</p> : null}
          {children}
        </div>
        <div className="mt-6 text-xs text-muted">{footer ?? <Link href="/sign-in" className="underline underline-offset-4">Back to sign in</Link>}</div>
      </div>
    </main>
  );
}
