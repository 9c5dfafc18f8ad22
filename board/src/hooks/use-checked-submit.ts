import { useState } from 'react';
import type { ZodType } from 'zod';
import { ApiError } from '@baytime/shared/client';
import { formErrorText, issuesToFieldErrors, type FieldErrors } from '@/lib/form-errors';

interface Save<T> {
  mutate: (value: T, options: { onSuccess: () => void; onError: (error: unknown) => void }) => void;
}

/**
 * A form's save: the shared zod schema checks the values first (errors at the field), then the
 * server; a 400 with field paths lands on the same fields, anything else on the form.
 */
export function useCheckedSubmit<T>(
  schema: ZodType<T>,
  save: Save<T>,
  adjust: (errors: FieldErrors) => FieldErrors = (e) => e,
) {
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  const submit = (values: unknown, onSaved: () => void) => {
    setFormError(null);
    const parsed = schema.safeParse(values);
    if (!parsed.success) return setErrors(adjust(issuesToFieldErrors(parsed.error.issues)));
    setErrors({});
    save.mutate(parsed.data, {
      onSuccess: onSaved,
      onError: (error) => {
        if (error instanceof ApiError && Object.keys(error.fieldErrors).length > 0)
          setErrors(adjust(error.fieldErrors));
        else setFormError(formErrorText(error));
      },
    });
  };

  return { errors, formError, submit };
}
