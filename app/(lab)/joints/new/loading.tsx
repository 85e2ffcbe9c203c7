import { LibrarySkeleton } from '@/components/joints/library-skeleton';

export default function Loading() {
  return <LibrarySkeleton />;
}
