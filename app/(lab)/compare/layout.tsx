import { requirePageUser } from '@/lib/auth/session';

// The role check sits here, above the segment's loading boundary, so a wrong role is redirected
// before anything streams.
export default async function CompareLayout({ children }: { children: React.ReactNode }) {
  await requirePageUser(['instructor', 'researcher']);
  return children;
}
