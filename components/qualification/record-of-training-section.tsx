import type { TraineeQualification } from '@/lib/data/qualification/training-records';
import { AuditHistory } from '../audit/audit-history';
import { ValidityForm } from './outcome-form';
import { DecisionPanel, type WitnessedAttempt } from './decision-panel';
import { CourseEvidenceSection } from './course-evidence-section';
import { IssueRecordButton, RecordActions } from './record-actions';
import { TrainingRecordList } from './training-record-list';

/** The trainee sheet's course outcome and record of training: evidence, decision, validity, records, history. */
export function RecordOfTrainingSection({ cohortId, traineeId, qualification, attempts }: { cohortId: number; traineeId: number; qualification: TraineeQualification; attempts: WitnessedAttempt[] }) {
  const { outcome, records, validityMonths, refresherLeadDays, history, evidence } = qualification;
  const hasLiveRecord = records.some((r) => r.status === 'valid' || r.status === 'expired');
  return (
    <>
      <CourseEvidenceSection cohortId={cohortId} traineeId={traineeId} evidence={evidence} checklistItems={evidence.checklist.filter((e) => !e.retired).map(({ id, label }) => ({ id, label }))} />
      <DecisionPanel cohortId={cohortId} traineeId={traineeId} outcome={outcome} evidence={evidence} attempts={attempts} />
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
