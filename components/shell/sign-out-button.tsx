'use client';

import { signOut } from 'next-auth/react';

export function SignOutButton() {
  return (
    <button type="button" onClick={() => signOut({ callbackUrl: '/sign-in' })}
      className="rounded-md border border-rule px-3 py-1.5 text-sm hover:bg-rule/60">
      Sign out
    </button>
  );
}
