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
  createWebhookSchema,
  WEBHOOK_EVENTS,
  type CreatedWebhook,
  type WebhookDeliveryStatus,
  type WebhookDto,
  type WebhookEvent,
} from '@baytime/shared';
import { formErrorText, issuesToFieldErrors, type FieldErrors } from '@/lib/form-errors';
import { shopDateTime } from '@/lib/date-format';
import { CheckboxGroup } from '@/components/checkbox-group';
import { ConfirmDialog } from '@/components/confirm-dialog';
import { useCreateWebhook } from '../api/create-webhook';
import { useWebhookDeliveries } from '../api/get-webhook-deliveries';
import { useWebhooks } from '../api/get-webhooks';
import { useRevokeWebhook } from '../api/revoke-webhook';

const EVENT_WORDS: Record<WebhookEvent, string> = {
  'job-line.finished': 'A job line is finished',
  'repair-order.ready': 'A repair order is ready (its last line finished)',
  'finding.answered': 'A finding is approved or declined',
  'pay-week.closed': 'A pay week is closed',
};

const STATUS_BADGE: Record<WebhookDeliveryStatus, 'brand' | 'important' | 'danger' | 'informative'> = {
  delivered: 'brand',
  pending: 'important',
  failed: 'danger',
  cancelled: 'informative',
};
const STATUS_WORDS: Record<WebhookDeliveryStatus, string> = {
  delivered: 'Delivered',
  pending: 'Retrying',
  failed: 'Gave up',
  cancelled: 'Cancelled: endpoint stopped',
};

const useStyles = makeStyles({
  card: {
    padding: tokens.spacingHorizontalXL,
    gap: tokens.spacingVerticalM,
    marginBottom: tokens.spacingVerticalXXL,
  },
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM, maxWidth: '40rem' },
  secret: { fontFamily: tokens.fontFamilyMonospace, width: '100%' },
  dim: { color: tokens.colorNeutralForeground3 },
  table: { tableLayout: 'auto', marginBottom: tokens.spacingVerticalXXL },
  attempts: { margin: 0, paddingLeft: '1.1rem' },
  pager: { display: 'flex', gap: tokens.spacingHorizontalM, alignItems: 'center' },
  section: { marginTop: tokens.spacingVerticalXL, marginBottom: tokens.spacingVerticalM },
});

export function CreateWebhookCard() {
  const styles = useStyles();
  const create = useCreateWebhook();
  const [url, setUrl] = useState('');
  const [events, setEvents] = useState<WebhookEvent[]>([]);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [made, setMade] = useState<CreatedWebhook | null>(null);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = createWebhookSchema.safeParse({ url: url.trim(), events });
    if (!parsed.success) return setErrors(issuesToFieldErrors(parsed.error.issues));
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: (answer) => {
        setMade(answer);
        setUrl('');
        setEvents([]);
      },
    });
  };

  return (
    <Card className={styles.card}>
      <Subtitle2 as="h2">Register an endpoint</Subtitle2>
      <form className={styles.form} onSubmit={submit} noValidate>
        <Field
          label="Address"
          required
          validationMessage={errors.url}
          hint="An https:// address of the other system"
        >
          <Input type="url" value={url} maxLength={500} onChange={(_, data) => setUrl(data.value)} />
        </Field>
        <CheckboxGroup
          label="Events"
          codes={WEBHOOK_EVENTS}
          words={EVENT_WORDS}
          checked={events}
          onChange={setEvents}
          error={errors.events}
        />
        <div>
          <Button appearance="primary" type="submit" disabled={create.isPending}>
            {create.isPending ? 'Registering…' : 'Register endpoint'}
          </Button>
        </div>
      </form>
      {create.isError && (
        <MessageBar intent="error">
          <MessageBarBody>{formErrorText(create.error)}</MessageBarBody>
        </MessageBar>
      )}
      {made && (
        <MessageBar intent="success" layout="multiline">
          <MessageBarBody>
            <MessageBarTitle>Endpoint registered.</MessageBarTitle>
            Its signing secret is shown this once: the receiver checks each delivery’s signature with it.
            <Field label="Signing secret">
              <Input
                readOnly
                value={made.secret}
                className={styles.secret}
                onFocus={(e) => e.target.select()}
              />
            </Field>
          </MessageBarBody>
        </MessageBar>
      )}
    </Card>
  );
}

function StopDialog({ webhook, onClose }: { webhook: WebhookDto; onClose: () => void }) {
  const revoke = useRevokeWebhook();
  return (
    <ConfirmDialog
      title={`Stop sending to ${webhook.url}?`}
      confirmLabel="Stop and drop pending deliveries"
      pendingLabel="Stopping…"
      keepLabel="Keep sending"
      pending={revoke.isPending}
      error={revoke.isError ? formErrorText(revoke.error) : null}
      onConfirm={() => revoke.mutate(webhook.id, { onSuccess: onClose })}
      onClose={onClose}
    >
      No event goes to this address from now on, and deliveries still waiting to be sent or retried there are
      dropped. This cannot be undone: register the address again to start over.
    </ConfirmDialog>
  );
}

/** Every time on it is shop time. */
export function WebhooksTable({ timeZone }: { timeZone: string | undefined }) {
  const at = shopDateTime(timeZone, true);
  const styles = useStyles();
  const webhooks = useWebhooks();
  const [stopping, setStopping] = useState<WebhookDto | null>(null);
  if (webhooks.isPending) return <Spinner label="Loading endpoints…" />;
  if (webhooks.isError)
    return (
      <MessageBar intent="error">
        <MessageBarBody>{formErrorText(webhooks.error)}</MessageBarBody>
      </MessageBar>
    );
  if (webhooks.data.length === 0) return <Body1 className={styles.dim}>No endpoints yet.</Body1>;
  return (
    <>
      <Table aria-label="Webhook endpoints" className={styles.table}>
        <TableHeader>
          <TableRow>
            <TableHeaderCell>Address</TableHeaderCell>
            <TableHeaderCell>Events</TableHeaderCell>
            <TableHeaderCell>Registered</TableHeaderCell>
            <TableHeaderCell>
              <span className="visually-hidden">Actions</span>
            </TableHeaderCell>
          </TableRow>
        </TableHeader>
        <TableBody>
          {webhooks.data.map((webhook) => (
            <TableRow key={webhook.id}>
              <TableCell>{webhook.url}</TableCell>
              <TableCell>{webhook.events.join(', ')}</TableCell>
              <TableCell>
                {at(webhook.createdAt)}{' '}
                {webhook.revokedAt && (
                  <Badge appearance="tint" color="danger">
                    Stopped {at(webhook.revokedAt)}
                  </Badge>
                )}
              </TableCell>
              <TableCell>
                {!webhook.revokedAt && (
                  <Button
                    size="small"
                    onClick={() => setStopping(webhook)}
                    aria-label={`Stop sending to ${webhook.url}`}
                  >
                    Stop sending…
                  </Button>
                )}
              </TableCell>
            </TableRow>
          ))}
        </TableBody>
      </Table>
      {stopping && <StopDialog webhook={stopping} onClose={() => setStopping(null)} />}
    </>
  );
}

/** Every delivery, newest first, with each attempt: when, the receiver's answer, or why none came. */
export function DeliveryLog({ timeZone }: { timeZone: string | undefined }) {
  const at = shopDateTime(timeZone, true);
  const styles = useStyles();
  const [cursors, setCursors] = useState<(string | null)[]>([null]);
  const deliveries = useWebhookDeliveries(cursors.at(-1) ?? null);
  return (
    <>
      <Subtitle2 as="h2" className={styles.section}>
        Delivery log
      </Subtitle2>
      {deliveries.isPending ? (
        <Spinner label="Loading deliveries…" />
      ) : deliveries.isError ? (
        <MessageBar intent="error">
          <MessageBarBody>{formErrorText(deliveries.error)}</MessageBarBody>
        </MessageBar>
      ) : deliveries.data.items.length === 0 ? (
        <Body1 className={styles.dim}>Nothing sent yet.</Body1>
      ) : (
        <>
          <Table aria-label="Webhook deliveries" className={styles.table}>
            <TableHeader>
              <TableRow>
                <TableHeaderCell>Event</TableHeaderCell>
                <TableHeaderCell>To</TableHeaderCell>
                <TableHeaderCell>Status</TableHeaderCell>
                <TableHeaderCell>Attempts</TableHeaderCell>
              </TableRow>
            </TableHeader>
            <TableBody>
              {deliveries.data.items.map((delivery) => (
                <TableRow key={delivery.id}>
                  <TableCell>
                    {delivery.event}
                    <br />
                    <Caption1 className={styles.dim}>{at(delivery.createdAt)}</Caption1>
                  </TableCell>
                  <TableCell>{delivery.url}</TableCell>
                  <TableCell>
                    <Badge appearance="tint" color={STATUS_BADGE[delivery.status]}>
                      {STATUS_WORDS[delivery.status]}
                    </Badge>
                    {delivery.nextAttemptAt && (
                      <Caption1 className={styles.dim}> next try {at(delivery.nextAttemptAt)}</Caption1>
                    )}
                  </TableCell>
                  <TableCell>
                    {delivery.attempts.length === 0 ? (
                      '—'
                    ) : (
                      <ol className={styles.attempts}>
                        {delivery.attempts.map((attempt) => (
                          <li key={attempt.at}>
                            {at(attempt.at)}:{' '}
                            {attempt.status === null ? 'no answer' : `answered ${attempt.status}`}
                            {attempt.error && attempt.status === null && ` (${attempt.error})`},{' '}
                            {attempt.durationMs} ms
                          </li>
                        ))}
                      </ol>
                    )}
                  </TableCell>
                </TableRow>
              ))}
            </TableBody>
          </Table>
          <div className={styles.pager}>
            <Button disabled={cursors.length === 1} onClick={() => setCursors((c) => c.slice(0, -1))}>
              Newer
            </Button>
            <Button
              disabled={!deliveries.data.nextCursor}
              onClick={() => setCursors((c) => [...c, deliveries.data.nextCursor])}
            >
              Older
            </Button>
            <Caption1 className={styles.dim}>{deliveries.data.total} deliveries in all</Caption1>
          </div>
        </>
      )}
    </>
  );
}
