import { Field, Input, Textarea } from '@fluentui/react-components';
import { editRepairOrderSchema, parseDecimal } from '@baytime/shared';
import { FormDialog } from '@/components/form-dialog';
import { showServerErrors, useSchemaForm } from '@/lib/form';
import { useEditRepairOrder } from '../api/repair-order-changes';
import type { RepairOrderSummary } from '../api/get-repair-orders';

const emptyAsMissing = (value: unknown) => (value === '' ? undefined : value);
const asNumber = (value: unknown) => (typeof value === 'string' ? (parseDecimal(value) ?? value) : value);

/** Corrections after the fact: the customer's contact, the vehicle and the concern, each audited. */
export function EditRepairOrderDialog({ ro, onClose }: { ro: RepairOrderSummary; onClose: () => void }) {
  const edit = useEditRepairOrder(ro.id);
  const form = useSchemaForm(editRepairOrderSchema, {
    defaultValues: {
      customer: {
        name: ro.customerName,
        phone: ro.customerPhone ?? undefined,
        email: ro.customerEmail ?? undefined,
      },
      vehicle: { plate: ro.plate ?? undefined, odometer: ro.odometer },
      concern: ro.concern,
    },
  });
  const { errors } = form.formState;
  return (
    <FormDialog
      title={`Edit RO ${ro.number}`}
      submitLabel="Save changes"
      pending={edit.isPending}
      formError={errors.root?.server?.message}
      onClose={onClose}
      onSubmit={form.handleSubmit((body) =>
        edit.mutate(body, { onSuccess: onClose, onError: (error) => showServerErrors(form, error) }),
      )}
    >
      <Field label="Customer" validationMessage={errors.customer?.name?.message}>
        <Input {...form.register('customer.name')} />
      </Field>
      <Field label="Phone" validationMessage={errors.customer?.phone?.message}>
        <Input type="tel" {...form.register('customer.phone')} />
      </Field>
      <Field label="E-mail" validationMessage={errors.customer?.email?.message}>
        <Input type="email" {...form.register('customer.email', { setValueAs: emptyAsMissing })} />
      </Field>
      <Field label="Plate" validationMessage={errors.vehicle?.plate?.message}>
        <Input {...form.register('vehicle.plate')} />
      </Field>
      <Field label="Odometer" validationMessage={errors.vehicle?.odometer?.message}>
        <Input inputMode="numeric" {...form.register('vehicle.odometer', { setValueAs: asNumber })} />
      </Field>
      <Field label="Concern" validationMessage={errors.concern?.message}>
        <Textarea rows={3} {...form.register('concern')} />
      </Field>
    </FormDialog>
  );
}
