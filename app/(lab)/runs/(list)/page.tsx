import type { Metadata } from 'next';
import { ExportPanel } from '@/components/runs/export-panel';
import { RunsTable } from '@/components/runs/runs-table';
import { runFilterOptions } from '@/lib/data/runs';
import { requirePageUser } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Runs' };
export const dynamic = 'force-dynamic';

export default async function RunsPage() {
  const user = await requirePageUser();
  const options = await runFilterOptions(user);
  const scopeNote = {
    admin: 'All runs in the lab.',
    researcher: 'All runs in the lab; operators are shown as stable pseudonyms.',
    instructor: 'Runs of your cohorts and your own.',
    trainee: 'Your own runs.',
  }[user.role];
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-semibold">Runs</h1>
        <p className="text-sm text-muted">{scopeNote} Choose a row to open its report.</p>
      </div>
      <RunsTable options={options} units={user.units} />
      <ExportPanel units={user.units} research={user.role === 'researcher' || user.role === 'admin'} />
    </div>
  );
}
