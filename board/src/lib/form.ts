import { zodResolver } from '@hookform/resolvers/zod';
import { useCallback, useReducer, useRef } from 'react';
import {
  useForm,
  type FieldValues,
  type Path,
  type RegisterOptions,
  type UseFormProps,
  type UseFormRegister,
  type UseFormReset,
  type UseFormReturn,
} from 'react-hook-form';
import { z } from 'zod';
import { ApiError } from '@baytime/shared/client';
import { formErrorText } from './form-errors';

/**
 * An office form on react-hook-form, checked by the same `shared` schema the server checks the body
 * with: a problem shows at its field before anything is sent.
 *
 * Fluent's inputs always pass a `value` to the native input, so a value react-hook-form writes into
 * the DOM (defaults, `reset`) is overwritten at the next render. `register` therefore also hands the
 * input the text to show: what the person typed, else the form's value.
 */
export function useSchemaForm<Schema extends z.ZodType<FieldValues, FieldValues>>(
  schema: Schema,
  options: Omit<UseFormProps<z.input<Schema>, unknown, z.output<Schema>>, 'resolver'> = {},
): UseFormReturn<z.input<Schema>, unknown, z.output<Schema>> {
  const form = useForm<z.input<Schema>, unknown, z.output<Schema>>({
    ...options,
    resolver: zodResolver(schema),
  });
  const typed = useRef(new Map<string, string>());
  const [, shown] = useReducer((count: number) => count + 1, 0);
  const register = useCallback(
    (name: Path<z.input<Schema>>, registerOptions?: RegisterOptions<z.input<Schema>>) => {
      const field = form.register(name, registerOptions);
      return {
        ...field,
        value: typed.current.get(name) ?? textOf(form.getValues(name)),
        onChange: (event: { target: { value: string } }) => {
          typed.current.set(name, event.target.value);
          shown();
          return field.onChange(event);
        },
      };
    },
    [form],
  ) as UseFormRegister<z.input<Schema>>;
  const reset = useCallback<UseFormReset<z.input<Schema>>>(
    (...args) => {
      typed.current.clear();
      form.reset(...args);
      shown();
    },
    [form],
  );
  // Spread at each render: `formState` is replaced on the form object as it changes.
  return { ...form, register, reset };
}

const textOf = (value: unknown): string =>
  typeof value === 'string' ? value : value === undefined || value === null ? '' : String(value);

/**
 * The server's refusal laid on the form: a 400's field errors at the same fields (through `fieldOf`
 * where the form names a field otherwise), anything else as the form's own message.
 */
export function showServerErrors<Values extends FieldValues>(
  form: Pick<UseFormReturn<Values>, 'setError'>,
  error: unknown,
  fieldOf: Record<string, string> = {},
): void {
  const fields = error instanceof ApiError ? Object.entries(error.fieldErrors) : [];
  for (const [path, message] of fields)
    form.setError((fieldOf[path] ?? path) as Path<Values>, { type: 'server', message });
  if (fields.length === 0) form.setError('root.server', { type: 'server', message: formErrorText(error) });
}

/**
 * For a form whose fields are typed otherwise than the body (dollars typed, cents sent): the form's
 * values become the body, which the `shared` schema checks, and each of its issues lands on the
 * field it came from (`fieldOf` names the form field of a body path where they differ).
 */
export function checkedAsBody<Form extends z.ZodType<FieldValues, FieldValues>, Body extends z.ZodType>(
  form: Form,
  toBody: (values: z.output<Form>) => unknown,
  body: Body,
  fieldOf: Record<string, string> = {},
) {
  return form.transform((values, ctx): z.output<Body> => {
    const parsed = body.safeParse(toBody(values));
    if (parsed.success) return parsed.data;
    for (const issue of parsed.error.issues) {
      const path = issue.path.map(String).join('.');
      ctx.addIssue({ code: 'custom', message: issue.message, path: [fieldOf[path] ?? path] });
    }
    return z.NEVER;
  });
}
