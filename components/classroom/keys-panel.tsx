'use client';

import { KEY_BINDINGS } from '@/lib/classroom/keyboard';

/** The dialog listing the classroom's keys. */
export function KeysPanel({ onClose }: { onClose: () => void }) {
  return (
    <div role="dialog" aria-modal="true" aria-labelledby="keys-heading" className="fixed inset-0 z-50 flex items-center justify-center bg-ink/40 p-6">
      <div className="w-full max-w-3xl rounded-card border border-rule bg-panel p-6 text-ink shadow-lg">
        <h2 id="keys-heading" className="text-room font-semibold">Keys</h2>
        <table className="mt-4 w-full text-2xl">
          <tbody>
            {KEY_BINDINGS.map((b) => (
              <tr key={b.action} className="border-b border-rule">
                <th scope="row" className="py-2 pr-6 text-left font-semibold">{b.keys.map((k) => <kbd key={k} className="mr-2 rounded border border-rule bg-paper px-2">{k}</kbd>)}</th>
                <td className="py-2">{b.does}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <button type="button" autoFocus onClick={onClose} className="mt-4 rounded-md bg-accent px-4 py-2 text-xl font-semibold text-accent-ink">Close</button>
      </div>
    </div>
  );
}
