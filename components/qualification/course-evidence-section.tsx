import type { CourseEvidenceDto } from '@/lib/data/qualification/course-evidence';
import { ChecklistEditor, ChecklistTicks } from './checklist-forms';
import { PassMarkForm, TheoryResultForm } from './theory-forms';

interface CourseEvidenceSectionProps {
  cohortId: number;
  traineeId: number;
  evidence: CourseEvidenceDto;
  /** The cohort's items in force, for the editor. */
  checklistItems: { id: number; label: string }[];
}

/** The trainee's theory result and observation checklist, and the cohort's pass mark and checklist (folded: they apply to every trainee). */
export function CourseEvidenceSection({ cohortId, traineeId, evidence, checklistItems }: CourseEvidenceSectionProps) {
  return (
    <section aria-labelledby="evidence-heading" className="no-print space-y-3 rounded-card border border-rule p-3">
      <h2 id="evidence-heading" className="font-semibold">Theory and observation</h2>
      <TheoryResultForm cohortId={cohortId} traineeId={traineeId} score={evidence.theory?.scorePercent ?? null} takenOn={evidence.theory?.takenOn ?? null} version={evidence.theory?.version ?? 0} />
      {evidence.checklist.length ? <ChecklistTicks cohortId={cohortId} traineeId={traineeId} entries={evidence.checklist} /> : <p className="text-sm text-muted">Set the cohort&rsquo;s observation checklist below to tick its items.</p>}
      <details className="rounded-md border border-rule p-2" open={checklistItems.length === 0}>
        <summary className="cursor-pointer text-sm font-medium">Cohort settings: theory pass mark and observation checklist (for every trainee of the cohort)</summary>
        <div className="mt-2 space-y-4">
          <PassMarkForm cohortId={cohortId} traineeId={traineeId} passMark={evidence.passMark} isDefault={evidence.passMarkIsDefault} />
          <ChecklistEditor cohortId={cohortId} traineeId={traineeId} items={checklistItems} />
        </div>
      </details>
    </section>
  );
}
