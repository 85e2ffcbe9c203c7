import type { Metadata } from 'next';
import { CompareView } from '@/components/compare/compare-view';
import { runFilterOptions } from '@/lib/data/runs';
import { requirePageUser } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Compare' };
export const dynamic = 'force-dynamic';

export default async function ComparePage() {
  const user = await requirePageUser(['instructor', 'researcher']);
  const options = await runFilterOptions(user);
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-semibold">Compare</h1>
        <p className="text-sm text-muted">
          Groups of complete runs side by side. Set-aside runs are left out. The choice lives in the address bar, so a comparison can be bookmarked and shared.
        </p>
      </div>
      <CompareView options={options} units={user.units} />
    </div>
  );
}
