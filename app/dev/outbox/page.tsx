import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { Wordmark } from '@/components/shell/wordmark';
import { listCapturedMail } from '@/lib/data/outbox';
import { outboxEnabled } from '@/lib/platform/env';
import { formatDateTime } from '@/lib/format/format-date';
import { requirePageUser } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Outbox (development)', robots: { index: false } };
export const dynamic = 'force-dynamic';

/** Plain text with http(s) links made clickable; everything else stays text (never HTML). */
function Linkified({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/[^\s<>"]+)/g);
  return (
    <>
      {parts.map((part, index) =>
        /^https?:\/\//.test(part) ? (
          <a key={index} href={part} className="break-all text-accent underline underline-offset-4">{part}</a>
        ) : (
          <span key={index}>{part}</span>
        ),
      )}
    </>
  );
}

export default async function OutboxPage() {
  if (!outboxEnabled()) notFound();
  const user = await requirePageUser();
  const mails = await listCapturedMail(user, 50);
  const everyone = user.role === 'admin';
  return (
    <main className="mx-auto max-w-4xl space-y-4 px-4 py-6">
      <div className="text-lg"><Wordmark /></div>
      <h1 className="text-2xl font-semibold">Outbox (development)</h1>
      <p className="text-sm text-muted">
        {everyone ? 'Every message' : `Messages sent to ${user.email}`} caught by the local mail catcher, newest first.
        Nothing here left this machine.
      </p>
      {mails.length === 0 ? (
        <p className="rounded-card border border-dashed border-rule bg-panel/50 p-6 text-center text-sm text-muted">
          {everyone ? 'No mail yet. Invite a trainee from a cohort, or ask for a password reset, and the message appears here.' : 'No mail to your address yet.'}
        </p>
      ) : (
        <ol className="space-y-3">
          {mails.map((mail) => (
            <li key={mail.id} className="rounded-card border border-rule bg-panel p-4">
              <div className="flex flex-wrap items-baseline gap-x-4 text-sm">
                <span className="font-semibold">{mail.subject}</span>
                <span className="text-muted">to {mail.to}</span>
                <span className="num ml-auto text-muted">{formatDateTime(mail.receivedAt)}</span>
              </div>
              <pre className="mt-2 whitespace-pre-wrap font-sans text-sm"><Linkified text={mail.text} /></pre>
            </li>
          ))}
        </ol>
      )}
    </main>
  );
}
