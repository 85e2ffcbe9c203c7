import type { Metadata } from 'next';
import { RecordTabs } from '@/components/record/record-tabs';
import { RECORD_ROLES, recordOptions } from '@/lib/data/record';
import { listStreamTokens } from '@/lib/data/stream-tokens';
import { readRecordPreferences } from '@/lib/data/preferences';
import { recordingRuns } from '@/lib/data/runs/live-stream';
import { requirePageUser } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Record · Evenload' };
export const dynamic = 'force-dynamic';

export default async function RecordPage() {
  const user = await requirePageUser(RECORD_ROLES);
  const [options, tokens, recordings, preferences] = await Promise.all([recordOptions(user), listStreamTokens(user), recordingRuns(user), readRecordPreferences(user)]);
  const who = {
    instructor: 'Record for yourself or a trainee of one of your cohorts.',
    researcher: 'Runs you record are yours; choose the cohort if the run belongs to one.',
    trainee: 'You record your own runs.',
    admin: '',
  }[user.role];
  return (
    <div className="space-y-4">
      <header>
        <h1 className="text-2xl font-semibold">Record a run</h1>
        <p className="text-sm text-muted">Fill in the run header once, then bring the loads in from a logger file, by hand, live from the logger, or from the simulator. {who}</p>
      </header>
      <RecordTabs options={options} tokens={tokens} recordings={recordings} user={{ id: user.id, role: user.role, units: user.units }} preferences={preferences} />
    </div>
  );
}
