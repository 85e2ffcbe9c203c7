import type { FormState } from '@/lib/http/form-state';

/**
 * The form-level message of every form, in a polite live region: success in the good colour,
 * anything else in the danger colour. `banner` draws it as a bordered box above a long form (the
 * joint library) and shows nothing before the first submit.
 */
export function FormMessage({ status, message, banner = false }: { status: FormState<unknown>['status']; message: string | null; banner?: boolean }) {
  if (banner) {
    return (
      <div aria-live="polite" role="status">
        {message && status !== 'idle' ? (
          <p className={`rounded-md border bg-panel p-3 text-sm ${status === 'ok' ? 'border-good text-good' : 'border-danger text-danger'}`}>{message}</p>
        ) : null}
      </div>
    );
  }
  return (
    <p role="status" aria-live="polite" className={`min-h-5 text-sm ${status === 'ok' ? 'text-good' : 'text-danger'}`}>
      {message}
    </p>
  );
}
