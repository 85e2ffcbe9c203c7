export default function RunsLoading() {
  return (
    <div aria-busy="true" aria-label="Loading runs" className="animate-pulse space-y-4">
      <div className="h-9 w-40 rounded bg-rule/60" />
      <div className="h-20 rounded-card bg-rule/40" />
      <div className="h-96 rounded-card bg-rule/40" />
    </div>
  );
}
