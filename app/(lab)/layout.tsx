import Link from 'next/link';
import { HeaderMenu } from '@/components/shell/header-menu';
import { NavLinks } from '@/components/shell/nav-links';
import { navItemsFor, ROLE_LABELS } from '@/components/shell/navigation';
import { SignOutButton, SignOutEverywhereButton } from '@/components/shell/sign-out-button';
import { Wordmark } from '@/components/shell/wordmark';
import { demoDataLoaded } from '@/lib/data/demo-data';
import { requirePageUser } from '@/lib/auth/session';
import { DEMO_NOTICE } from '@/lib/demo/notice';

export default async function LabLayout({ children }: { children: React.ReactNode }) {
  const user = await requirePageUser();
  const demo = await demoDataLoaded();
  return (
    <div className="min-h-screen">
      <header className="no-print border-b border-rule bg-panel">
        <nav aria-label="Main" className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-4 gap-y-3 px-4 py-3">
          <Link href="/" className="text-lg text-ink">
            <Wordmark />
          </Link>
          <HeaderMenu>
            <NavLinks items={navItemsFor(user.role)} />
            <div className="flex flex-wrap items-center gap-3 text-sm sm:ml-auto">
              <span>
                <span className="font-medium">{user.name}</span>{' '}
                <span className="rounded bg-rule/70 px-1.5 py-0.5 text-xs text-ink">{ROLE_LABELS[user.role]}</span>
              </span>
              <SignOutButton />
              <SignOutEverywhereButton />
            </div>
          </HeaderMenu>
        </nav>
      </header>
      <main className="mx-auto max-w-7xl break-words px-4 py-6">{children}</main>
      {demo ? (
        <footer className="mx-auto max-w-7xl px-4 pb-6 text-xs text-muted">
          <p>{DEMO_NOTICE}</p>
        </footer>
      ) : null}
    </div>
  );
}
