import { useState } from 'react';
import { Field, Input, Textarea } from '@fluentui/react-components';
import { editRepairOrderSchema, formatPhone, parseDecimal } from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { FormDialog } from '@/components/form-dialog';
import { showServerErrors, useSchemaForm } from '@/lib/form';
import { useEditRepairOrder } from '../api/repair-order-changes';
import type { RepairOrderSummary } from '../api/get-repair-orders';

const asNumber = (value: unknown) => (typeof value === 'string' ? (parseDecimal(value) ?? value) : value);

/**
 * Corrections after the fact: the customer's contact, the vehicle and the concern, each audited. A
 * contact or plate left empty is taken off; a reading the server finds lower than the vehicle's
 * highest is saved once the advisor says why, as at intake.
 */
export function EditRepairOrderDialog({ ro, onClose }: { ro: RepairOrderSummary; onClose: () => void }) {
  const edit = useEditRepairOrder(ro.id);
  const form = useSchemaForm(editRepairOrderSchema, {
    defaultValues: {
      customer: {
        name: ro.customerName,
        phone: ro.customerPhone ? formatPhone(ro.customerPhone) : undefined,
        email: ro.customerEmail ?? undefined,
      },
      vehicle: { plate: ro.plate ?? undefined, odometer: ro.odometer },
      concern: ro.concern,
    },
  });
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
      onSubmit={form.handleSubmit((body) =>
        edit.mutate(odometerRefused ? { ...body, odometerOverrideReason: odometerReason } : body, {
          onSuccess: onClose,
          onError: (error) => {
            showServerErrors(form, error);
            if (error instanceof ApiError && error.fieldErrors['vehicle.odometer']) setOdometerRefused(true);
          },
        }),
      )}
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
    </FormDialog>
  );
}
