import type { TrainingRecordDto } from '@/lib/data/qualification/training-records';
import { formatDate } from '@/lib/format/format-date';
import { RECORD_STATUS_LABEL } from '@/lib/qualification/training-record';
import { formatVerificationCode } from '@/lib/qualification/verification-code';

/** Records of training with their status and downloads (A4 or Letter); `actions` adds the instructor's controls per record. */
export function TrainingRecordList({ records, actions }: { records: TrainingRecordDto[]; actions?: (record: TrainingRecordDto) => React.ReactNode }) {
  return (
    <ul className="space-y-3">
      {records.map((record) => (
        <li key={record.id} className="rounded-card border border-rule p-3 text-sm" data-record-code={record.code}>
          <p className="font-medium">
            {record.courseName} · {record.scope} · <span className={record.status === 'valid' ? 'text-good' : 'text-danger'}>{RECORD_STATUS_LABEL[record.status]}</span>
          </p>
          <p>
            Code <span className="num font-mono">{formatVerificationCode(record.code)}</span> · issued <span className="num">{formatDate(record.issuedOn)}</span> by {record.issuedByName} · valid until <span className="num">{formatDate(record.validUntil)}</span>
            {record.revokeReason && record.status === 'revoked' ? <> · reason: {record.revokeReason}</> : null}
          </p>
          <p className="no-print mt-1 flex flex-wrap gap-3">
            <a href={`/api/training-records/${record.id}/pdf?paper=a4`} className="underline underline-offset-4" download>Download PDF (A4)</a>
            <a href={`/api/training-records/${record.id}/pdf?paper=letter`} className="underline underline-offset-4" download>Download PDF (Letter)</a>
            <a href={`/verify/${record.code}`} className="underline underline-offset-4">Public check page</a>
          </p>
          {actions && (record.status === 'valid' || record.status === 'expired') ? actions(record) : null}
        </li>
      ))}
    </ul>
  );
}
