import type { TraineeQualification } from '@/lib/data/qualification/training-records';
import { formatDateTime } from '@/lib/format/format-date';
import { AuditHistory } from '../audit/audit-history';
import { OutcomeForm, ValidityForm } from './outcome-form';
import { IssueRecordButton, RecordActions } from './record-actions';
import { TrainingRecordList } from './training-record-list';

/** The trainee sheet's course outcome and record of training: decision, validity, records, history. */
export function RecordOfTrainingSection({ cohortId, traineeId, qualification }: { cohortId: number; traineeId: number; qualification: TraineeQualification }) {
  const { outcome, records, validityMonths, refresherLeadDays, history } = qualification;
  const hasLiveRecord = records.some((r) => r.status === 'valid' || r.status === 'expired');
  return (
    <>
      <section aria-labelledby="outcome-heading" className="break-inside-avoid space-y-2 rounded-card border border-rule p-3">
        <h2 id="outcome-heading" className="font-semibold">Course outcome</h2>
        {outcome ? (
          <p className="text-sm">
            <strong>{outcome.decision === 'pass' ? 'Pass' : 'Not yet'}</strong>{outcome.scopes.length ? ` · ${outcome.scopes.join(', ')}` : ''} · decided by {outcome.decidedByName} on <span className="num">{formatDateTime(outcome.decidedAt)}</span>
          </p>
        ) : <p className="text-sm text-muted">No decision yet.</p>}
        <div className="no-print"><OutcomeForm cohortId={cohortId} traineeId={traineeId} outcome={outcome} /></div>
      </section>
      <section aria-labelledby="record-heading" className="break-inside-avoid space-y-3 rounded-card border border-rule p-3">
        <h2 id="record-heading" className="font-semibold">Record of training</h2>
        <div className="no-print"><ValidityForm cohortId={cohortId} traineeId={traineeId} months={validityMonths} leadDays={refresherLeadDays} /></div>
        {records.length ? (
          <TrainingRecordList records={records} actions={(record) => <div className="no-print"><RecordActions cohortId={cohortId} traineeId={traineeId} recordId={record.id} /></div>} />
        ) : <p className="text-sm text-muted">No record of training issued.</p>}
        {outcome?.decision === 'pass' && !hasLiveRecord ? <div className="no-print"><IssueRecordButton cohortId={cohortId} traineeId={traineeId} /></div> : null}
        {outcome?.decision !== 'pass' ? <p className="text-sm text-muted">A record of training can be issued once the decision is a pass.</p> : null}
      </section>
      {history.length ? <div className="no-print"><AuditHistory entries={history} title="History of the outcome and records" /></div> : null}
    </>
  );
}
