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
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { createUserSchema, type CreateUserBody, type UserDto } from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { formErrorText, issuesToFieldErrors, type FieldErrors } from '@/lib/form-errors';
import { useCreateUser } from '../api/create-user';
import { EMPTY_PAY, PAY_FIELD_OF, PayFields, payBody, type PayDraft } from './pay-fields';
import { ROLE_LABELS } from './users-table';

type NewRole = CreateUserBody['role'];

interface Draft extends PayDraft {
  role: NewRole;
  name: string;
  email: string;
  password: string;
  badge: string;
  pin: string;
  skillLevel: string;
}

const EMPTY: Draft = {
  role: 'technician',
  name: '',
  email: '',
  password: '',
  badge: '',
  pin: '',
  skillLevel: '3',
  ...EMPTY_PAY,
};

const FIELD_OF: Record<string, keyof Draft> = PAY_FIELD_OF;

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
    const pay = payBody(draft);
    Object.assign(body, pay.body);
    Object.assign(moneyErrors, pay.errors);
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
              <PayFields
                draft={draft}
                errors={errors}
                onChange={(key, value) => set(key, value as Draft[typeof key])}
              />
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
