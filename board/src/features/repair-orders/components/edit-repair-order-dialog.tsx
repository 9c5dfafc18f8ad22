import { useState } from 'react';
import { Field, Input, Textarea, makeStyles, tokens } from '@fluentui/react-components';
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
import { useEditRepairOrder } from '../api/repair-order-changes';
import type { RepairOrderSummary } from '../api/get-repair-orders';
import { changedFields } from '../ro-model';

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
  const [opened] = useState(() => ({
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
  }));
  const form = useSchemaForm(editRepairOrderSchema, { defaultValues: opened });
  const [openedPromise] = useState(() => (timeZone ? promiseText(ro.promisedAt, timeZone) : null));
  const [promise, setPromise] = useState(openedPromise);
  const [promiseError, setPromiseError] = useState<string | null>(null);
  const [odometerRefused, setOdometerRefused] = useState(false);
  const [odometerReason, setOdometerReason] = useState('');
  const { errors } = form.formState;

  return (
    <FormDialog
      title={`Edit RO ${ro.number}`}
      submitLabel="Save changes"
      pending={edit.isPending}
      formError={errors.root?.server?.message}
      onClose={onClose}
      onSubmit={form.handleSubmit((edited) => {
        const promised =
          promise && openedPromise && timeZone
            ? promiseToSend(promise, openedPromise, timeZone)
            : { promisedAt: undefined };
        if ('error' in promised) return setPromiseError(promised.error);
        const body = {
          ...changedFields(editRepairOrderSchema.safeParse(opened).data ?? {}, edited),
          ...(promised.promisedAt !== undefined && { promisedAt: promised.promisedAt }),
        };
        if (Object.keys(body).length === 0) return onClose();
        edit.mutate(odometerRefused ? { ...body, odometerOverrideReason: odometerReason } : body, {
          onSuccess: onClose,
          onError: (error) => {
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
    </FormDialog>
  );
}
