import { FormErrorBar } from '@/components/form-error-bar';
import { useState, type FormEvent } from 'react';
import {
  Button,
  Card,
  Field,
  Input,
  MessageBar,
  MessageBarBody,
  Select,
  Subtitle2,
  Switch,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { createUserSchema, type CreateUserBody, type UserDto } from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { dollarsToCents, formErrorText, issuesToFieldErrors, type FieldErrors } from '@/lib/form-errors';
import { useCreateUser } from '../api/create-user';
import { ROLE_LABELS } from './users-table';

type NewRole = CreateUserBody['role'];

interface Draft {
  role: NewRole;
  name: string;
  email: string;
  password: string;
  badge: string;
  pin: string;
  skillLevel: string;
  flatRate: string;
  hourlyRate: string;
  overtimeExempt: boolean;
}

const EMPTY: Draft = {
  role: 'technician',
  name: '',
  email: '',
  password: '',
  badge: '',
  pin: '',
  skillLevel: '3',
  flatRate: '',
  hourlyRate: '',
  overtimeExempt: false,
};

/** Form fields that hold a body field under another name (dollars typed, cents sent). */
const FIELD_OF: Record<string, keyof Draft> = { flatRateCents: 'flatRate', hourlyRateCents: 'hourlyRate' };

const useStyles = makeStyles({
  card: {
    padding: tokens.spacingHorizontalXL,
    gap: tokens.spacingVerticalM,
    marginBottom: tokens.spacingVerticalXXL,
  },
  grid: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(14rem, 1fr))',
    gap: `${tokens.spacingVerticalM} ${tokens.spacingHorizontalL}`,
    alignItems: 'start',
  },
  actions: { display: 'flex', gap: tokens.spacingHorizontalM, alignItems: 'center' },
});

function toBody(draft: Draft): { body: Partial<CreateUserBody>; moneyErrors: FieldErrors } {
  const moneyErrors: FieldErrors = {};
  const body: Partial<CreateUserBody> = { name: draft.name, role: draft.role };
  if (draft.role === 'technician') {
    body.badge = draft.badge;
    body.pin = draft.pin;
    body.skillLevel = Number(draft.skillLevel);
    body.overtimeExempt = draft.overtimeExempt;
    for (const [field, key] of [
      ['flatRate', 'flatRateCents'],
      ['hourlyRate', 'hourlyRateCents'],
    ] as const) {
      if (!draft[field].trim()) continue;
      const cents = dollarsToCents(draft[field]);
      if (cents === null) moneyErrors[field] = 'Type an amount in dollars, like 28.50';
      else body[key] = cents;
    }
  } else {
    body.email = draft.email.trim();
    body.password = draft.password;
  }
  return { body, moneyErrors };
}

export function AddUserForm({ onAdded }: { onAdded?: (user: UserDto) => void }) {
  const styles = useStyles();
  const create = useCreateUser();
  const [draft, setDraft] = useState<Draft>(EMPTY);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [added, setAdded] = useState<string | null>(null);
  const tech = draft.role === 'technician';

  const set = <K extends keyof Draft>(key: K, value: Draft[K]) => {
    setDraft((current) => ({ ...current, [key]: value }));
    setErrors((current) => ({ ...current, [key]: undefined }));
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    setAdded(null);
    const { body, moneyErrors } = toBody(draft);
    const parsed = createUserSchema.safeParse(body);
    const fieldErrors = parsed.success ? {} : issuesToFieldErrors(parsed.error.issues);
    const mapped: FieldErrors = { ...moneyErrors };
    for (const [key, message] of Object.entries(fieldErrors)) mapped[FIELD_OF[key] ?? key] ??= message;
    if (!parsed.success || Object.keys(moneyErrors).length) {
      setErrors(mapped);
      return;
    }
    create.mutate(parsed.data, {
      onSuccess: (user) => {
        setDraft({ ...EMPTY, role: draft.role });
        setErrors({});
        setAdded(`${user.name} was added.`);
        onAdded?.(user);
      },
      onError: (error) => {
        if (error instanceof ApiError && error.status === 409) {
          setErrors(
            tech
              ? { badge: 'Someone already has this badge' }
              : { email: 'Someone already uses this e-mail' },
          );
          return;
        }
        if (error instanceof ApiError && Object.keys(error.fieldErrors).length) {
          const server: FieldErrors = {};
          for (const [key, message] of Object.entries(error.fieldErrors))
            server[FIELD_OF[key] ?? key] = message;
          setErrors(server);
          return;
        }
        setFormError(formErrorText(error));
      },
    });
  };

  return (
    <Card className={styles.card}>
      <Subtitle2 as="h2">Add a person</Subtitle2>
      <form onSubmit={submit} noValidate>
        <div className={styles.grid}>
          <Field label="Role" required>
            <Select value={draft.role} onChange={(_, data) => set('role', data.value as NewRole)}>
              {(['technician', 'foreman', 'advisor', 'owner'] as const).map((role) => (
                <option key={role} value={role}>
                  {ROLE_LABELS[role]}
                </option>
              ))}
            </Select>
          </Field>
          <Field label="Full name" required validationMessage={errors.name}>
            <Input value={draft.name} onChange={(_, data) => set('name', data.value)} autoComplete="off" />
          </Field>
          {tech ? (
            <>
              <Field label="Badge number" required validationMessage={errors.badge} hint="3 to 8 digits">
                <Input
                  value={draft.badge}
                  inputMode="numeric"
                  onChange={(_, data) => set('badge', data.value)}
                />
              </Field>
              <Field label="PIN" required validationMessage={errors.pin} hint="4 to 8 digits">
                <Input
                  value={draft.pin}
                  type="password"
                  inputMode="numeric"
                  autoComplete="new-password"
                  onChange={(_, data) => set('pin', data.value)}
                />
              </Field>
              <Field
                label="Skill level"
                validationMessage={errors.skillLevel}
                hint="1 (apprentice) to 5 (master)"
              >
                <Select value={draft.skillLevel} onChange={(_, data) => set('skillLevel', data.value)}>
                  {[1, 2, 3, 4, 5].map((level) => (
                    <option key={level} value={level}>
                      {level}
                    </option>
                  ))}
                </Select>
              </Field>
              <Field label="Flat rate per flagged hour ($)" validationMessage={errors.flatRate}>
                <Input
                  value={draft.flatRate}
                  inputMode="decimal"
                  onChange={(_, data) => set('flatRate', data.value)}
                />
              </Field>
              <Field label="Hourly rate, non-productive time ($)" validationMessage={errors.hourlyRate}>
                <Input
                  value={draft.hourlyRate}
                  inputMode="decimal"
                  onChange={(_, data) => set('hourlyRate', data.value)}
                />
              </Field>
              <Field
                label="Overtime"
                hint="Exempt only where the law allows it; check with your payroll provider."
              >
                <Switch
                  checked={draft.overtimeExempt}
                  onChange={(_, data) => set('overtimeExempt', data.checked)}
                  label={draft.overtimeExempt ? 'Exempt from overtime' : 'Paid overtime'}
                />
              </Field>
            </>
          ) : (
            <>
              <Field label="E-mail" required validationMessage={errors.email}>
                <Input
                  type="email"
                  value={draft.email}
                  autoComplete="off"
                  onChange={(_, data) => set('email', data.value)}
                />
              </Field>
              <Field
                label="Password"
                required
                validationMessage={errors.password}
                hint="At least 10 characters"
              >
                <Input
                  type="password"
                  value={draft.password}
                  autoComplete="new-password"
                  onChange={(_, data) => set('password', data.value)}
                />
              </Field>
            </>
          )}
        </div>
        <FormErrorBar message={formError} />
        {added && (
          <MessageBar intent="success">
            <MessageBarBody>{added}</MessageBarBody>
          </MessageBar>
        )}
        <div className={styles.actions} style={{ marginTop: tokens.spacingVerticalL }}>
          <Button appearance="primary" type="submit" disabled={create.isPending}>
            {create.isPending ? 'Adding…' : tech ? 'Add technician' : 'Add office user'}
          </Button>
        </div>
      </form>
    </Card>
  );
}
