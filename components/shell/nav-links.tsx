'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import type { NavItem } from './navigation';

export function NavLinks({ items }: { items: NavItem[] }) {
  const pathname = usePathname();
  return (
    <ul className="flex flex-wrap items-center gap-1">
      {items.map((item) => {
        const active = item.href === '/' ? pathname === '/' : pathname.startsWith(item.href);
        return (
          <li key={item.href}>
            <Link href={item.href} aria-current={active ? 'page' : undefined}
              className={`rounded-md px-3 py-1.5 text-sm ${active ? 'bg-ink text-paper' : 'text-ink hover:bg-rule/60'}`}>
              {item.label}
            </Link>
          </li>
        );
      })}
    </ul>
  );
}
