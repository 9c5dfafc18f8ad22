import { useState } from 'react';
import {
  Button,
  Field,
  Input,
  MessageBar,
  MessageBarActions,
  MessageBarBody,
  Textarea,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import {
  editRepairOrderSchema,
  formatPhone,
  parseDecimal,
  shopDayKey,
  shopLocalInstant,
} from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { FormDialog } from '@/components/form-dialog';
import { showServerErrors, useSchemaForm } from '@/lib/form';
import { isStaleEdit, useEditRepairOrder, useReloadRepairOrder } from '../api/repair-order-changes';
import type { RepairOrderSummary } from '../api/get-repair-orders';
import { changedFields, keepEditsOnReload, readFields, type ReplacedEdit } from '../ro-model';

const useStyles = makeStyles({
  pair: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM },
});

const asNumber = (value: unknown) => (typeof value === 'string' ? (parseDecimal(value) ?? value) : value);

const PROMISE_PASSED = 'That time has already passed: promise a later one';

/** The promise as the shop's wall clock shows it: 'YYYY-MM-DD' and 'HH:MM', both empty without one. */
function promiseText(promisedAt: string | null, timeZone: string) {
  if (!promisedAt) return { date: '', time: '' };
  const at = new Date(promisedAt);
  const time = new Intl.DateTimeFormat('en-GB', {
    timeZone,
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
  }).format(at);
  return { date: shopDayKey(at, timeZone), time };
}

type PromiseText = { date: string; time: string };

/** The form's fields as the RO was read. */
function fieldsOf(ro: RepairOrderSummary) {
  return {
    customer: {
      name: ro.customerName,
      phone: ro.customerPhone ? formatPhone(ro.customerPhone) : '',
      email: ro.customerEmail ?? '',
    },
    vehicle: {
      year: ro.vehicleYear,
      make: ro.vehicleMake,
      model: ro.vehicleModel,
      plate: ro.plate ?? '',
      odometer: ro.odometer,
    },
    concern: ro.concern,
  };
}

/**
 * The server's words on an edit refused because someone else saved first, with the way on: read it
 * again, which puts their change in the fields and the advisor's own changes back around it.
 */
export function StaleEditBar({
  message,
  reloading,
  onReload,
}: {
  message: string;
  reloading: boolean;
  onReload: () => void;
}) {
  return (
    <MessageBar intent="warning" layout="multiline">
      <MessageBarBody>
        <div>{message}</div>
        <div>Reload shows their change and puts back what you typed wherever it did not conflict.</div>
      </MessageBarBody>
      <MessageBarActions>
        <Button size="small" disabled={reloading} onClick={onReload}>
          {reloading ? 'Reloading…' : 'Reload'}
        </Button>
      </MessageBarActions>
    </MessageBar>
  );
}

/** A field the reload gave the other person's value, with what the advisor had typed there. */
export interface ReplacedWords {
  label: string;
  yours: string;
}

/** After a reload: the advisor's changes are back but not saved, and the words theirs displaced. */
export function ReloadedBar({ keptAny, replaced }: { keptAny: boolean; replaced: readonly ReplacedWords[] }) {
  return (
    <MessageBar intent="info" layout="multiline">
      <MessageBarBody>
        {keptAny
          ? 'Their change is in the form and your other changes are back: save to keep them.'
          : 'Their change is in the form.'}
        {replaced.map(({ label, yours }) => (
          <div key={label}>
            {label} now shows their change; you had typed {yours}.
          </div>
        ))}
      </MessageBarBody>
    </MessageBar>
  );
}

/** What the advisor had typed, as a sentence quotes it. */
export const typedWords = (value: unknown): string =>
  value === null || value === undefined || String(value).trim() === '' ? 'nothing' : `“${String(value)}”`;

/** The replaced fields named by their labels; a field without a label by its path. */
export const replacedWords = (
  replaced: readonly ReplacedEdit[],
  labels: Readonly<Record<string, string>>,
  words: (edit: ReplacedEdit) => string = ({ yours }) => typedWords(yours),
): ReplacedWords[] => replaced.map((edit) => ({ label: labels[edit.path] ?? edit.path, yours: words(edit) }));

const FIELD_LABELS: Readonly<Record<string, string>> = {
  'customer.name': 'Customer',
  'customer.phone': 'Phone',
  'customer.email': 'E-mail',
  'vehicle.year': 'Year',
  'vehicle.make': 'Make',
  'vehicle.model': 'Model',
  'vehicle.plate': 'Plate',
  'vehicle.odometer': 'Odometer',
  concern: 'Concern',
  promise: 'The promise',
};

/** The promise to send: undefined when untouched, null when cleared, or why it cannot be sent. */
function promiseToSend(
  promise: PromiseText,
  opened: PromiseText,
  timeZone: string,
  now = Date.now(),
): { promisedAt: string | null | undefined } | { error: string } {
  if (promise.date === opened.date && promise.time === opened.time) return { promisedAt: undefined };
  if (!promise.date && !promise.time) return { promisedAt: null };
  if (!/^\d{4}-\d{2}-\d{2}$/.test(promise.date) || !/^\d{2}:\d{2}$/.test(promise.time))
    return { error: 'Give both the date and the time, or neither' };
  const at = shopLocalInstant(promise.date, promise.time, timeZone);
  return at.getTime() <= now ? { error: PROMISE_PASSED } : { promisedAt: at.toISOString() };
}

/**
 * Corrections after the fact: the customer's contact, the vehicle, the concern and the promise, each
 * audited. A contact or plate left empty is taken off; a reading the server finds lower than the
 * vehicle's highest is saved once the advisor says why, as at intake.
 */
export function EditRepairOrderDialog({
  ro,
  timeZone,
  onClose,
}: {
  ro: RepairOrderSummary;
  timeZone: string | undefined;
  onClose: () => void;
}) {
  const styles = useStyles();
  const edit = useEditRepairOrder(ro.id);
  const reload = useReloadRepairOrder(ro.id);
  // The RO as the dialog read it, not as the page now shows it: the edit names what it changes from.
  const [read, setRead] = useState(ro);
  const [opened, setOpened] = useState(() => fieldsOf(ro));
  const form = useSchemaForm(editRepairOrderSchema, { defaultValues: opened });
  const promiseOf = (from: RepairOrderSummary) => (timeZone ? promiseText(from.promisedAt, timeZone) : null);
  const [openedPromise, setOpenedPromise] = useState(() => promiseOf(ro));
  const [promise, setPromise] = useState(openedPromise);
  const [promiseError, setPromiseError] = useState<string | null>(null);
  const [odometerRefused, setOdometerRefused] = useState(false);
  const [odometerReason, setOdometerReason] = useState('');
  const [stale, setStale] = useState<string | null>(null);
  const [reloading, setReloading] = useState(false);
  const [reloaded, setReloaded] = useState<{ keptAny: boolean; replaced: ReplacedWords[] } | null>(null);
  const { errors } = form.formState;

  const readAgain = () => {
    const edited = form.getValues();
    // Date and time make one promise: kept or replaced together, never mixed with theirs.
    const asOne = (p: PromiseText | null) => (p ? [p.date, p.time] : null);
    setReloading(true);
    reload()
      .then((fresh) => {
        const freshPromise = promiseOf(fresh);
        const merged = keepEditsOnReload(
          { ...opened, promise: asOne(openedPromise) },
          { ...edited, promise: asOne(promise) },
          { ...fieldsOf(fresh), promise: asOne(freshPromise) },
        );
        const { promise: keptPromise, ...fields } = merged.values;
        setRead(fresh);
        setOpened(fieldsOf(fresh));
        form.reset(fields);
        setOpenedPromise(freshPromise);
        setPromise(keptPromise ? { date: keptPromise[0]!, time: keptPromise[1]! } : freshPromise);
        setPromiseError(null);
        if (!merged.kept.includes('vehicle.odometer')) {
          setOdometerRefused(false);
          setOdometerReason('');
        }
        setStale(null);
        setReloaded({
          keptAny: merged.kept.length > 0,
          replaced: replacedWords(merged.replaced, FIELD_LABELS, ({ path, yours }) =>
            path === 'promise'
              ? Array.isArray(yours) && yours.join('')
                ? `“${yours.join(' ')}”`
                : 'no promise'
              : typedWords(yours),
          ),
        });
      })
      .catch((error: unknown) => showServerErrors(form, error))
      .finally(() => setReloading(false));
  };

  return (
    <FormDialog
      title={`Edit RO ${ro.number}`}
      submitLabel="Save changes"
      pending={edit.isPending || reloading}
      formError={errors.root?.server?.message}
      onClose={onClose}
      onSubmit={form.handleSubmit((edited) => {
        const promised =
          promise && openedPromise && timeZone
            ? promiseToSend(promise, openedPromise, timeZone)
            : { promisedAt: undefined };
        if ('error' in promised) return setPromiseError(promised.error);
        const openedFields = editRepairOrderSchema.safeParse(opened).data ?? {};
        const body = {
          ...changedFields(openedFields, edited),
          ...(promised.promisedAt !== undefined && { promisedAt: promised.promisedAt }),
        };
        if (Object.keys(body).length === 0) return onClose();
        const sent = { ...body, was: readFields({ ...openedFields, promisedAt: read.promisedAt }, body) };
        edit.mutate(odometerRefused ? { ...sent, odometerOverrideReason: odometerReason } : sent, {
          onSuccess: onClose,
          onError: (error) => {
            if (isStaleEdit(error)) {
              setReloaded(null);
              return setStale(error.message);
            }
            showServerErrors(form, error);
            if (error instanceof ApiError && error.fieldErrors['vehicle.odometer']) setOdometerRefused(true);
          },
        });
      })}
    >
      <Field label="Customer" validationMessage={errors.customer?.name?.message}>
        <Input {...form.register('customer.name')} />
      </Field>
      <Field label="Phone" validationMessage={errors.customer?.phone?.message}>
        <Input type="tel" {...form.register('customer.phone')} />
      </Field>
      <Field label="E-mail" validationMessage={errors.customer?.email?.message}>
        <Input type="email" {...form.register('customer.email')} />
      </Field>
      <div className={styles.pair}>
        <Field label="Year" validationMessage={errors.vehicle?.year?.message}>
          <Input inputMode="numeric" {...form.register('vehicle.year', { setValueAs: asNumber })} />
        </Field>
        <Field label="Make" validationMessage={errors.vehicle?.make?.message}>
          <Input {...form.register('vehicle.make')} />
        </Field>
        <Field label="Model" validationMessage={errors.vehicle?.model?.message}>
          <Input {...form.register('vehicle.model')} />
        </Field>
      </div>
      <Field label="Plate" validationMessage={errors.vehicle?.plate?.message}>
        <Input {...form.register('vehicle.plate')} />
      </Field>
      <Field label="Odometer" validationMessage={errors.vehicle?.odometer?.message}>
        <Input
          inputMode="numeric"
          {...form.register('vehicle.odometer', {
            setValueAs: asNumber,
            onChange: () => {
              setOdometerRefused(false);
              setOdometerReason('');
            },
          })}
        />
      </Field>
      {odometerRefused && (
        <Field
          label="Reading is right? Say why it is lower"
          validationMessage={errors.odometerOverrideReason?.message}
          hint="For example: instrument cluster replaced. The reason is kept with the RO."
        >
          <Input autoFocus value={odometerReason} onChange={(_, data) => setOdometerReason(data.value)} />
        </Field>
      )}
      <Field label="Concern" validationMessage={errors.concern?.message}>
        <Textarea rows={3} {...form.register('concern')} />
      </Field>
      {promise && (
        <div className={styles.pair} role="group" aria-label="Promised for (shop time)">
          <Field
            label="Promised date"
            validationMessage={promiseError ?? errors.promisedAt?.message}
            hint="Empty both when no time was promised"
          >
            <Input
              type="date"
              value={promise.date}
              onChange={(_, data) => {
                setPromise({ ...promise, date: data.value });
                setPromiseError(null);
              }}
            />
          </Field>
          <Field label="Promised time">
            <Input
              type="time"
              value={promise.time}
              onChange={(_, data) => {
                setPromise({ ...promise, time: data.value });
                setPromiseError(null);
              }}
            />
          </Field>
        </div>
      )}
      {stale && <StaleEditBar message={stale} reloading={reloading} onReload={readAgain} />}
      {reloaded && <ReloadedBar {...reloaded} />}
    </FormDialog>
  );
}
