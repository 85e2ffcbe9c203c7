'use client';

import { useSearchParams } from 'next/navigation';
import { useState } from 'react';

const FILTER_KEYS = ['methodId', 'lubricantId', 'cohortId', 'operatorId', 'jointId', 'from', 'to', 'status', 'source'] as const;
const RESEARCH_KEYS = ['cohortId', 'methodId', 'lubricantId', 'jointId', 'from', 'to'] as const;

/** Exports of the runs the table shows: the normalised readings, and for researchers the pseudonymised form. */
export function ExportPanel({ units, research }: { units: 'si' | 'us'; research: boolean }) {
  const params = useSearchParams();
  const [key, setKey] = useState('');
  const pick = (keys: readonly string[]) => {
    const out = new URLSearchParams();
    for (const k of keys) {
      const v = params.get(k);
      if (v) out.set(k, v);
    }
    return out;
  };
  const selection = pick(FILTER_KEYS);
  const href = (format: 'csv' | 'json') => `/api/runs/export?${new URLSearchParams([...selection.entries(), ['format', format], ['units', units]]).toString()}`;
  const researchParams = pick(RESEARCH_KEYS);
  const keyOk = key.trim().length >= 8;
  return (
    <section aria-labelledby="export-heading" className="no-print rounded-card border border-rule bg-panel p-3 text-sm">
      <h2 id="export-heading" className="font-semibold">Export these runs</h2>
      <p className="text-muted">One row per reading, with the filters above, in {units === 'si' ? 'newtons' : 'pounds-force'}. Cells are made safe for spreadsheets.</p>
      <div className="mt-2 flex flex-wrap gap-2">
        <a className="rounded-md border border-rule px-3 py-1.5 hover:bg-rule/60" href={href('csv')} download>CSV</a>
        <a className="rounded-md border border-rule px-3 py-1.5 hover:bg-rule/60" href={href('json')}>JSON</a>
      </div>
      {research ? (
        // A form post: the key travels in the body, never in the address (history, logs, Referer).
        <form method="post" action="/api/exports/runs.csv" onSubmit={(e) => { if (!keyOk) e.preventDefault(); }} className="mt-3 border-t border-rule pt-3">
          {[...researchParams.entries()].map(([name, value]) => <input key={name} type="hidden" name={name} value={value} />)}
          <label htmlFor="export-key" className="block font-medium">Research export (pseudonymised)</label>
          <p id="export-key-hint" className="text-xs text-muted">Complete runs only. Operators become stable pseudonyms under your export key (at least 8 characters); the file holds no names or e-mail addresses. Use the same key to get the same pseudonyms next time.</p>
          <div className="mt-1 flex flex-wrap items-center gap-2">
            <input id="export-key" name="key" autoComplete="off" value={key} onChange={(e) => setKey(e.target.value)} aria-describedby="export-key-hint export-key-error" className="rounded-md border border-rule bg-paper px-2 py-1.5" placeholder="e.g. lube-study-2026" />
            {keyOk ? (
              <button type="submit" className="rounded-md bg-accent px-3 py-1.5 text-accent-ink">Download pseudonymised CSV</button>
            ) : (
              <span id="export-key-error" aria-live="polite" className="text-xs text-muted">{key ? 'The key needs at least 8 characters.' : 'Enter a key to download.'}</span>
            )}
          </div>
        </form>
      ) : null}
    </section>
  );
}
