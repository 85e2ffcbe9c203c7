/** The loading skeleton of the joint-library pages: a heading and form-shaped panels. */
export function LibrarySkeleton({ panels = 3 }: { panels?: number }) {
  return (
    <div aria-busy="true" aria-label="Loading" className="animate-pulse space-y-4">
      <div className="h-8 w-72 rounded bg-rule/60" />
      <div className="h-4 w-96 rounded bg-rule/40" />
      {Array.from({ length: panels }, (_, i) => (
        <div key={i} className="h-40 rounded-card bg-rule/40" />
      ))}
    </div>
  );
}
