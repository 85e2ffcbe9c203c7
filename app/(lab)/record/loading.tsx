/** A skeleton of the record page: title, the run header's two rows of fields, the tabs, the panel. */
export default function RecordLoading() {
  return (
    <div aria-busy="true" aria-label="Loading the record page" className="animate-pulse space-y-4">
      <div className="h-8 w-56 rounded bg-rule/60" />
      <div className="grid gap-3 rounded-card border border-rule p-4 sm:grid-cols-2 lg:grid-cols-4">
        {Array.from({ length: 7 }, (_, key) => (
          <div key={key} className="h-14 rounded bg-rule/40" />
        ))}
      </div>
      <div className="flex gap-2">
        {[0, 1, 2, 3].map((key) => (
          <div key={key} className="h-9 w-32 rounded-t bg-rule/50" />
        ))}
      </div>
      <div className="h-48 rounded-card bg-rule/40" />
    </div>
  );
}
