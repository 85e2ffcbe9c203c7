export default function RunReportLoading() {
  return (
    <div aria-busy="true" aria-label="Loading the run report" className="animate-pulse space-y-4">
      <div className="h-9 w-96 rounded bg-rule/60" />
      <div className="h-16 rounded-card bg-rule/40" />
      <div className="grid gap-4 lg:grid-cols-2">
        <div className="h-80 rounded-card bg-rule/40" />
        <div className="h-80 rounded-card bg-rule/40" />
      </div>
      <div className="h-72 rounded-card bg-rule/40" />
    </div>
  );
}
