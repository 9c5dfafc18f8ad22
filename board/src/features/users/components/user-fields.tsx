import type { PathValue, UseFormReturn } from 'react-hook-form';
import { Field, Input, Select } from '@fluentui/react-components';
import { ROLE_LABELS, type UserFields } from '../user-form';
import { PayFields } from './pay-fields';

export interface UserFieldsGridProps<Body> {
  form: UseFormReturn<UserFields, unknown, Body>;
  /** Editing: an empty PIN or password keeps the one on file. */
  editing?: boolean;
}

/** The people form's fields, the same for adding and editing; a technician's rates change in the pay dialog. */
export function UserFieldsGrid<Body>({ form, editing = false }: UserFieldsGridProps<Body>) {
  const { errors } = form.formState;
  const tech = form.watch('role') === 'technician';
  const keep = editing ? 'Leave empty to keep the current one' : undefined;
  return (
    <>
      <Field label="Role" required>
        <Select {...form.register('role')}>
          {(['technician', 'foreman', 'advisor', 'owner'] as const).map((role) => (
            <option key={role} value={role}>
              {ROLE_LABELS[role]}
            </option>
          ))}
        </Select>
      </Field>
      <Field label="Full name" required validationMessage={errors.name?.message}>
        <Input autoComplete="off" {...form.register('name')} />
      </Field>
      {tech ? (
        <>
          <Field label="Badge number" required validationMessage={errors.badge?.message} hint="3 to 8 digits">
            <Input inputMode="numeric" {...form.register('badge')} />
          </Field>
          <Field
            label={editing ? 'New PIN' : 'PIN'}
            required={!editing}
            validationMessage={errors.pin?.message}
            hint={keep ?? '4 to 8 digits'}
          >
            <Input
              type="password"
              inputMode="numeric"
              autoComplete="new-password"
              {...form.register('pin')}
            />
          </Field>
          <Field
            label="Skill level"
            validationMessage={errors.skillLevel?.message}
            hint="1 (apprentice) to 5 (master)"
          >
            <Select {...form.register('skillLevel')}>
              {[1, 2, 3, 4, 5].map((level) => (
                <option key={level} value={level}>
                  {level}
                </option>
              ))}
            </Select>
          </Field>
          {!editing && (
            <PayFields
              draft={{
                payType: form.watch('payType'),
                flatRate: form.watch('flatRate'),
                hourlyRate: form.watch('hourlyRate'),
                guarantee: form.watch('guarantee'),
                paidOvertime: form.watch('paidOvertime'),
              }}
              errors={{
                flatRate: errors.flatRate?.message,
                hourlyRate: errors.hourlyRate?.message,
                guarantee: errors.guarantee?.message,
              }}
              onChange={(key, value) =>
                form.setValue(key, value as PathValue<UserFields, typeof key>, { shouldDirty: true })
              }
            />
          )}
        </>
      ) : (
        <>
          <Field label="E-mail" required validationMessage={errors.email?.message}>
            <Input type="email" autoComplete="off" {...form.register('email')} />
          </Field>
          <Field
            label={editing ? 'New password' : 'Password'}
            required={!editing}
            validationMessage={errors.password?.message}
            hint={keep ?? 'At least 10 characters'}
          >
            <Input type="password" autoComplete="new-password" {...form.register('password')} />
          </Field>
        </>
      )}
    </>
  );
}
