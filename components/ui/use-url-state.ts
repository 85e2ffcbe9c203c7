'use client';

import { usePathname, useRouter, useSearchParams } from 'next/navigation';

/**
 * State that lives in the address bar (so a view can be bookmarked and shared): the current search
 * params, and `update` to set or clear some of them. Keys in `resetOnChange` (such as the page
 * number) are cleared whenever anything else changes. `history: 'push'` adds a history entry per
 * change, so Back returns to the previous filter or page; `'replace'` (the default) does not.
 */
export function useUrlState(resetOnChange: readonly string[] = [], history: 'push' | 'replace' = 'replace') {
  const router = useRouter();
  const pathname = usePathname();
  const params = useSearchParams();
  function update(changes: Record<string, string | null>) {
    const next = new URLSearchParams(params.toString());
    for (const [key, value] of Object.entries(changes)) {
      if (value === null || value === '') next.delete(key);
      else next.set(key, value);
    }
    for (const key of resetOnChange) if (!(key in changes)) next.delete(key);
    const text = next.toString();
    const href = `${pathname}${text ? `?${text}` : ''}`;
    if (history === 'push') router.push(href, { scroll: false });
    else router.replace(href, { scroll: false });
  }
  return { params, update };
}
