import { startTransition, type FormEvent } from 'react';

/**
 * An onSubmit handler that runs a useActionState action without React's automatic form reset, so
 * a refused entry stays in the field to be corrected (React resets uncontrolled fields after a
 * form `action` completes). Keep the form's `action` prop too: before hydration the browser then
 * posts the server action natively instead of submitting a plain GET.
 */
export function keepValuesSubmit(action: (form: FormData) => void) {
  return (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    startTransition(() => action(form));
  };
}
