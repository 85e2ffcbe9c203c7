export default function RecordLoading() {
  return (
    <div aria-busy="true" aria-label="Loading" className="animate-pulse space-y-4">
      <div className="h-8 w-64 rounded bg-rule/60" />
      <div className="grid gap-4 md:grid-cols-3">
        {[0, 1, 2].map((key) => (
          <div key={key} className="h-28 rounded-card bg-rule/40" />
        ))}
      </div>
      <div className="h-64 rounded-card bg-rule/40" />
    </div>
  );
}
