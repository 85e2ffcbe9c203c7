/** The polite live region beside a field that says what is wrong with it. */
export function FieldError({ id, messages }: { id: string; messages?: string[] | undefined }) {
  return (
    <p id={id} aria-live="polite" className="min-h-5 text-sm text-danger">
      {messages?.[0] ?? null}
    </p>
  );
}

/** The form-level message: green-ish for success, danger for failure. */
export function FormMessage({ ok, message }: { ok: boolean; message: string | null }) {
  return (
    <p role="status" aria-live="polite" className={`min-h-5 text-sm ${ok ? 'text-good' : 'text-danger'}`}>
      {message}
    </p>
  );
}
