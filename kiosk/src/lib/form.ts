import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, type FieldValues, type Path, type UseFormProps, type UseFormReturn } from 'react-hook-form';
import type { z } from 'zod';
import { ApiError } from '@baytime/shared/client';
import { commandProblem } from './commands';

/**
 * A kiosk form on react-hook-form, checked by the same `shared` schema the server checks the body
 * with: a problem shows at its field before anything is sent.
 */
export function useSchemaForm<Schema extends z.ZodType<FieldValues, FieldValues>>(
  schema: Schema,
  options: Omit<UseFormProps<z.input<Schema>, unknown, z.output<Schema>>, 'resolver'> = {},
): UseFormReturn<z.input<Schema>, unknown, z.output<Schema>> {
  return useForm<z.input<Schema>, unknown, z.output<Schema>>({ ...options, resolver: zodResolver(schema) });
}

/** The server's refusal laid on the form: a 400's field errors at their fields, anything else on the form. */
export function showServerErrors<Values extends FieldValues>(
  form: Pick<UseFormReturn<Values>, 'setError'>,
  error: unknown,
): void {
  const fields = error instanceof ApiError ? Object.entries(error.fieldErrors) : [];
  for (const [path, message] of fields) form.setError(path as Path<Values>, { type: 'server', message });
  if (fields.length === 0) form.setError('root.server', { type: 'server', message: commandProblem(error) });
}
