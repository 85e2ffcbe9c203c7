'use client';

import { usePathname } from 'next/navigation';
import { useState } from 'react';

/**
 * The header's links and account controls: in a row from the small breakpoint up; on a phone
 * behind a "Menu" button (so the header stays one line high), closed again after each navigation.
 */
export function HeaderMenu({ children }: { children: React.ReactNode }) {
  const pathname = usePathname();
  const [openOn, setOpenOn] = useState<string | null>(null);
  const open = openOn === pathname;
  return (
    <>
      <button type="button" aria-expanded={open} aria-controls="header-menu" onClick={() => setOpenOn(open ? null : pathname)}
        className="ml-auto rounded-md border border-rule px-3 py-1.5 text-sm sm:hidden">
        Menu <span aria-hidden="true">{open ? '▴' : '▾'}</span>
      </button>
      <div id="header-menu" className={`${open ? 'flex' : 'hidden'} w-full flex-col items-start gap-3 sm:flex sm:w-auto sm:flex-1 sm:flex-row sm:flex-wrap sm:items-center sm:gap-4`}>
        {children}
      </div>
    </>
  );
}
