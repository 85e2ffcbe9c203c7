/** The polite live region beside a field that says what is wrong with it. */
export function FieldError({ id, messages }: { id: string; messages?: string[] | undefined }) {
  return (
    <p id={id} aria-live="polite" className="min-h-5 text-sm text-danger">
      {messages?.[0] ?? null}
    </p>
  );
}
