'use client';

import { useState } from 'react';

/** A small button that copies `text` to the clipboard and says so (or says to copy by hand when the browser refuses). */
export function CopyButton({ text, label }: { text: string; label: string }) {
  const [outcome, setOutcome] = useState<'copied' | 'refused' | null>(null);
  const copy = () => navigator.clipboard?.writeText(text).then(() => setOutcome('copied'), () => setOutcome('refused')) ?? setOutcome('refused');
  return (
    <span className="inline-flex items-center gap-2">
      <button type="button" onClick={copy} className="rounded-md border border-rule bg-paper px-2 py-1 text-xs">{label}</button>
      <span aria-live="polite" className="text-xs text-muted">{outcome === 'copied' ? 'Copied.' : outcome === 'refused' ? 'The browser did not allow copying: select the text and copy it.' : ''}</span>
    </span>
  );
}
