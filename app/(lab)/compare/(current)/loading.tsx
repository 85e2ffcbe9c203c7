export default function CompareLoading() {
  return (
    <div aria-busy="true" aria-label="Loading the comparison" className="animate-pulse space-y-4">
      <div className="h-9 w-48 rounded bg-rule/60" />
      <div className="h-24 rounded-card bg-rule/40" />
      <div className="grid gap-4 lg:grid-cols-2"><div className="h-80 rounded-card bg-rule/40" /><div className="h-80 rounded-card bg-rule/40" /></div>
    </div>
  );
}
