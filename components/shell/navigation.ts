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
  { href: '/progress', label: 'Progress', roles: ['trainee'] },
  { href: '/compare', label: 'Compare', roles: ['instructor', 'researcher'] },
  { href: '/classroom', label: 'Classroom', roles: ['instructor'] },
  { href: '/cohorts', label: 'Cohorts', roles: ['instructor', 'admin'] },
  { href: '/joints', label: 'Joints', roles: ['instructor', 'admin'] },
  { href: '/calculator', label: 'Calculator', roles: ['admin', 'instructor', 'researcher', 'trainee'] },
  { href: '/people', label: 'People', roles: ['admin'] },
  { href: '/equipment', label: 'Equipment', roles: ['admin'] },
  { href: '/admin/jobs', label: 'Jobs', roles: ['admin'] },
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
