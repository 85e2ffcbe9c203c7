import type { CourseEvidenceDto } from '@/lib/data/qualification/course-evidence';
import type { CourseOutcomeDto } from '@/lib/data/qualification/course-outcomes';
import { formatDate, formatDateTime } from '@/lib/format/format-date';
import { OutcomeForm } from './outcome-form';

export interface WitnessedAttempt {
  runId: number;
  recordedAt: string;
  methodName: string;
  verdict: { allMet: boolean; signedByName: string; signedAt: string } | null;
}

interface DecisionPanelProps {
  cohortId: number;
  traineeId: number;
  outcome: CourseOutcomeDto | null;
  evidence: CourseEvidenceDto;
  attempts: WitnessedAttempt[];
}

const verdictText = (a: WitnessedAttempt) =>
  a.verdict ? `signed off by ${a.verdict.signedByName} on ${formatDateTime(a.verdict.signedAt)}: ${a.verdict.allMet ? 'every criterion met' : 'not every criterion met'}` : 'not signed off yet';

/** The course decision and what stands behind it: witnessed attempts and verdicts, theory against the pass mark, checklist observed and outstanding. */
export function DecisionPanel({ cohortId, traineeId, outcome, evidence, attempts }: DecisionPanelProps) {
  const inForce = evidence.checklist.filter((e) => !e.retired);
  const observed = inForce.filter((e) => e.tick?.observed);
  const notObserved = inForce.filter((e) => !e.tick?.observed);
  return (
    <section aria-labelledby="outcome-heading" className="break-inside-avoid space-y-3 rounded-card border border-rule p-3">
      <h2 id="outcome-heading" className="font-semibold">Course outcome</h2>
      <div className="grid gap-3 text-sm md:grid-cols-3">
        <div className="min-w-0">
          <h3 className="font-medium">Witnessed practical attempts</h3>
          {attempts.length ? (
            <ul className="mt-1 list-disc space-y-1 pl-5" aria-label="Witnessed practical attempts">
              {attempts.map((a, i) => <li key={a.runId}>Attempt {i + 1} · <span className="num">{formatDateTime(a.recordedAt)}</span> · {a.methodName}: {verdictText(a)}</li>)}
            </ul>
          ) : <p className="mt-1 text-muted">None yet.</p>}
        </div>
        <div className="min-w-0">
          <h3 className="font-medium">Theory</h3>
          {evidence.theory ? (
            <p className="mt-1" data-testid="theory-summary">
              <strong>{evidence.theory.passed ? 'Passed' : 'Not yet'}</strong>: <span className="num">{evidence.theory.scorePercent} %</span> against the pass mark of <span className="num">{evidence.passMark} %</span>, taken {formatDate(evidence.theory.takenOn)} (entered by {evidence.theory.enteredByName})
            </p>
          ) : <p className="mt-1 text-muted" data-testid="theory-summary">No result yet (pass mark <span className="num">{evidence.passMark} %</span>).</p>}
        </div>
        <div className="min-w-0">
          <h3 className="font-medium">Observation checklist</h3>
          <p className="mt-1" data-testid="checklist-summary">{inForce.length ? `${observed.length} of ${inForce.length} observed` : 'No checklist set for this cohort.'}</p>
          {notObserved.length ? <p className="text-muted">Outstanding: {notObserved.map((e) => e.label).join(', ')}</p> : null}
        </div>
      </div>
      {evidence.outstanding.length ? (
        <div role="note" className="rounded-md border border-caution bg-paper p-2 text-sm">
          <p className="font-medium">Outstanding for a pass</p>
          <ul className="list-disc pl-5">{evidence.outstanding.map((item) => <li key={item}>{item}</li>)}</ul>
          <p className="mt-1 text-muted">A pass is recorded only with a reason for the override.</p>
        </div>
      ) : <p className="text-sm text-good">Nothing outstanding for a pass.</p>}
      {outcome ? (
        <p className="text-sm" data-testid="outcome-summary">
          <strong>{outcome.decision === 'pass' ? 'Pass' : 'Not yet'}</strong>{outcome.scopes.length ? ` · ${outcome.scopes.join(', ')}` : ''} · decided by {outcome.decidedByName} on <span className="num">{formatDateTime(outcome.decidedAt)}</span>
          {outcome.overrideReason ? <> · override: &ldquo;{outcome.overrideReason}&rdquo;</> : null}
        </p>
      ) : <p className="text-sm text-muted">No decision yet.</p>}
      <div className="no-print"><OutcomeForm cohortId={cohortId} traineeId={traineeId} outcome={outcome} outstanding={evidence.outstanding} /></div>
    </section>
  );
}
