import Link from 'next/link';
import type { UploadOutcome } from './upload-request';

/**
 * A stored upload: complete, or held for review by the run check, with its reasons and the link
 * to the report where an instructor or researcher confirms it or sets it aside.
 */
export function SavedOutcome({ outcome }: { outcome: Extract<UploadOutcome, { kind: 'saved' }> }) {
  const link = <Link className="underline" href={`/runs/${outcome.runId}`}>Open run {outcome.runId}</Link>;
  if (!outcome.needsReview) {
    return <p className="text-sm text-good" role="status">Saved run {outcome.runId} with {outcome.stepCount} steps. {link}</p>;
  }
  return (
    <div className="rounded-md border border-caution p-3 text-sm" role="status">
      <p className="font-medium text-caution">
        Saved run {outcome.runId} with {outcome.stepCount} steps. It needs review before it counts: it stays out of comparisons and assessments until an
        instructor or researcher confirms it or sets it aside on its report.
      </p>
      {outcome.reviewReasons.length ? (
        <ul className="mt-1 list-disc pl-5">
          {outcome.reviewReasons.map((reason) => <li key={reason.rule + reason.message}>{reason.message}</li>)}
        </ul>
      ) : null}
      <p className="mt-1">{link}</p>
    </div>
  );
}
