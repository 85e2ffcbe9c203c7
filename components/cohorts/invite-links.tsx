'use client';

import { useState } from 'react';

/** Invitation links whose e-mail could not be sent, each with a copy button, to hand over another way. */
export function InviteLinks({ links }: { links: ReadonlyArray<{ email: string; link: string }> | undefined }) {
  const [copied, setCopied] = useState<string | null>(null);
  if (!links?.length) return null;
  const copy = async (link: string) => {
    await navigator.clipboard.writeText(link).then(() => setCopied(link), () => setCopied(null));
  };
  return (
    <div className="space-y-2 rounded-md border border-caution/60 bg-paper p-3 text-sm">
      <p>
        Hand these links over in person or by another channel. Each one lets only that person set a password and expires after
        72 hours; anyone holding the link can use it, so do not post it where others can read it.
      </p>
      <ul className="space-y-2">
        {links.map(({ email, link }) => (
          <li key={link} className="space-y-1">
            <div className="font-medium">{email}</div>
            <div className="flex flex-wrap items-center gap-2">
              <input readOnly value={link} aria-label={`Invitation link for ${email}`} className="min-w-0 flex-1 rounded-md border border-rule bg-panel px-2 py-1 font-mono text-xs" onFocus={(e) => e.currentTarget.select()} />
              <button type="button" onClick={() => void copy(link)} className="rounded-md border border-rule px-3 py-1 hover:bg-rule/60">
                {copied === link ? 'Copied' : 'Copy link'}
              </button>
            </div>
          </li>
        ))}
      </ul>
    </div>
  );
}
