import { useState, type FormEvent } from 'react';
import {
  Badge,
  Body1,
  Button,
  Caption1,
  Card,
  Field,
  Input,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Spinner,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import {
  createIntegrationKeySchema,
  INTEGRATION_SCOPES,
  type CreatedIntegrationKey,
  type IntegrationKeyDto,
  type IntegrationScope,
} from '@baytime/shared';
import { CheckboxGroup } from '@/components/checkbox-group';
import { ConfirmDialog } from '@/components/confirm-dialog';
import { formErrorText, issuesToFieldErrors, type FieldErrors } from '@/lib/form-errors';
import { shopDateTime } from '@/lib/date-format';
import { useCreateIntegrationKey } from '../api/create-integration-key';
import { useIntegrationKeys } from '../api/get-integration-keys';
import { useRevokeIntegrationKey } from '../api/revoke-integration-key';

const SCOPE_WORDS: Record<IntegrationScope, string> = {
  'repair-orders:read': 'Read repair orders',
  'repair-orders:write': 'Write repair orders (import from another system)',
  'reports:read': 'Read the labour and pay reports and the payroll export',
  'punches:read': 'Read timecards',
};

const useStyles = makeStyles({
  card: {
    padding: tokens.spacingHorizontalXL,
    gap: tokens.spacingVerticalM,
    marginBottom: tokens.spacingVerticalXXL,
  },
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM, maxWidth: '36rem' },
  secret: { fontFamily: tokens.fontFamilyMonospace, width: '100%' },
  dim: { color: tokens.colorNeutralForeground3 },
  table: { tableLayout: 'auto' },
  actions: { textAlign: 'right', width: '8rem' },
});

function ShownOnce({ made }: { made: CreatedIntegrationKey }) {
  const styles = useStyles();
  return (
    <MessageBar intent="success" layout="multiline">
      <MessageBarBody>
        <MessageBarTitle>Key “{made.key.name}” made.</MessageBarTitle>
        Copy it now into the other system: Baytime keeps only a fingerprint and cannot show it again.
        <Field label="Integration key">
          <Input
            readOnly
            value={made.secret}
            className={styles.secret}
            onFocus={(event) => event.target.select()}
          />
        </Field>
      </MessageBarBody>
    </MessageBar>
  );
}

export function CreateIntegrationKeyCard() {
  const styles = useStyles();
  const create = useCreateIntegrationKey();
  const [name, setName] = useState('');
  const [scopes, setScopes] = useState<IntegrationScope[]>([]);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [made, setMade] = useState<CreatedIntegrationKey | null>(null);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = createIntegrationKeySchema.safeParse({ name, scopes });
    if (!parsed.success) return setErrors(issuesToFieldErrors(parsed.error.issues));
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: (answer) => {
        setMade(answer);
        setName('');
        setScopes([]);
      },
    });
  };

  return (
    <Card className={styles.card}>
      <Subtitle2 as="h2">Make a key</Subtitle2>
      <form className={styles.form} onSubmit={submit} noValidate>
        <Field
          label="Name"
          required
          validationMessage={errors.name}
          hint="The system that will use it, e.g. “Front counter”"
        >
          <Input value={name} maxLength={60} onChange={(_, data) => setName(data.value)} />
        </Field>
        <CheckboxGroup
          label="What it may do"
          codes={INTEGRATION_SCOPES}
          words={SCOPE_WORDS}
          checked={scopes}
          onChange={setScopes}
          error={errors.scopes}
        />
        <div>
          <Button appearance="primary" type="submit" disabled={create.isPending}>
            {create.isPending ? 'Making the key…' : 'Make key'}
          </Button>
        </div>
      </form>
      {create.isError && (
        <MessageBar intent="error">
          <MessageBarBody>{formErrorText(create.error)}</MessageBarBody>
        </MessageBar>
      )}
      {made && <ShownOnce made={made} />}
    </Card>
  );
}

function RevokeDialog({
  integrationKey,
  onClose,
}: {
  integrationKey: IntegrationKeyDto;
  onClose: () => void;
}) {
  const revoke = useRevokeIntegrationKey();
  return (
    <ConfirmDialog
      title={`Revoke “${integrationKey.name}”?`}
      confirmLabel="Revoke key"
      pendingLabel="Revoking…"
      pending={revoke.isPending}
      error={revoke.isError ? formErrorText(revoke.error) : null}
      onConfirm={() => revoke.mutate(integrationKey.id, { onSuccess: onClose })}
      onClose={onClose}
    >
      Every call made with it is refused from now on. This cannot be undone: make a new key instead.
    </ConfirmDialog>
  );
}

/** Every time on it is shop time. */
export function IntegrationKeysTable({ timeZone }: { timeZone: string | undefined }) {
  const at = shopDateTime(timeZone);
  const styles = useStyles();
  const keys = useIntegrationKeys();
  const [revoking, setRevoking] = useState<IntegrationKeyDto | null>(null);
  if (keys.isPending) return <Spinner label="Loading keys…" />;
  if (keys.isError)
    return (
      <MessageBar intent="error">
        <MessageBarBody>{formErrorText(keys.error)}</MessageBarBody>
      </MessageBar>
    );
  if (keys.data.length === 0) return <Body1 className={styles.dim}>No integration keys yet.</Body1>;
  return (
    <>
      <Table aria-label="Integration keys" className={styles.table}>
        <TableHeader>
          <TableRow>
            <TableHeaderCell>Key</TableHeaderCell>
            <TableHeaderCell>Scopes</TableHeaderCell>
            <TableHeaderCell>Made</TableHeaderCell>
            <TableHeaderCell>Last used</TableHeaderCell>
            <TableHeaderCell>
              <span className="visually-hidden">Actions</span>
            </TableHeaderCell>
          </TableRow>
        </TableHeader>
        <TableBody>
          {keys.data.map((key) => (
            <TableRow key={key.id}>
              <TableCell>
                {key.name} <Caption1 className={styles.dim}>{key.hint}…</Caption1>{' '}
                {key.revokedAt && (
                  <Badge appearance="tint" color="danger">
                    Revoked {at(key.revokedAt)}
                  </Badge>
                )}
              </TableCell>
              <TableCell>{key.scopes.join(', ')}</TableCell>
              <TableCell>
                {at(key.createdAt)}
                {key.createdByName && <Caption1 className={styles.dim}> by {key.createdByName}</Caption1>}
              </TableCell>
              <TableCell>{at(key.lastUsedAt)}</TableCell>
              <TableCell className={styles.actions}>
                {!key.revokedAt && (
                  <Button size="small" onClick={() => setRevoking(key)} aria-label={`Revoke ${key.name}`}>
                    Revoke…
                  </Button>
                )}
              </TableCell>
            </TableRow>
          ))}
        </TableBody>
      </Table>
      {revoking && <RevokeDialog integrationKey={revoking} onClose={() => setRevoking(null)} />}
    </>
  );
}
