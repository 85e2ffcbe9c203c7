import type { Role } from '@/models/user';

export interface NavItem {
  href: string;
  label: string;
  roles: readonly Role[];
}

/** The signed-in navigation, by role (see PRODUCT.md "Screens and navigation"). */
export const NAV_ITEMS: readonly NavItem[] = [
  { href: '/', label: 'Home', roles: ['admin', 'instructor', 'researcher', 'trainee'] },
  { href: '/runs', label: 'Runs', roles: ['admin', 'instructor', 'researcher', 'trainee'] },
  { href: '/record', label: 'Record', roles: ['instructor', 'researcher', 'trainee'] },
  { href: '/compare', label: 'Compare', roles: ['instructor', 'researcher'] },
  { href: '/calculator', label: 'Calculator', roles: ['admin', 'instructor', 'researcher', 'trainee'] },
  { href: '/joints', label: 'Joints', roles: ['instructor', 'admin'] },
  { href: '/classroom', label: 'Classroom', roles: ['instructor'] },
];

export function navItemsFor(role: Role): NavItem[] {
  return NAV_ITEMS.filter((item) => item.roles.includes(role));
}

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  instructor: 'Instructor',
  researcher: 'Researcher',
  trainee: 'Trainee',
};
