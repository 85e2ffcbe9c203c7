import type { TrainingRecordDto } from '@/lib/data/qualification/training-records';
import { formatDate } from '@/lib/format/format-date';
import { TrainingRecordList } from './training-record-list';

/** The trainee's own records of training on Progress: download, the public check, and when to requalify. */
export function MyRecordsSection({ records }: { records: TrainingRecordDto[] }) {
  if (!records.length) return null;
  const current = records.find((r) => r.status === 'valid');
  return (
    <section aria-labelledby="records-heading" className="space-y-2 rounded-card border border-rule bg-panel p-4">
      <h2 id="records-heading" className="font-semibold">Your records of training</h2>
      {current ? (
        <p className="text-sm">Refresher due by <strong className="num">{formatDate(current.validUntil)}</strong>: your record of training for “{current.courseName}” is valid until then.</p>
      ) : <p className="text-sm text-muted">None of your records is valid now; ask your training centre about a refresher course.</p>}
      <TrainingRecordList records={records} />
    </section>
  );
}
