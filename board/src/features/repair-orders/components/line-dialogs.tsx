import { Field, Input, Textarea } from '@fluentui/react-components';
import {
  lineWithTitleWords,
  lineWords,
  addJobLineSchema,
  cancelJobLineSchema,
  editJobLineSchema,
  parseDecimal,
  type JobLineDto,
} from '@baytime/shared';
import { FormDialog } from '@/components/form-dialog';
import { showServerErrors, useSchemaForm } from '@/lib/form';
import { useAddJobLine, useCancelJobLine, useEditJobLine } from '../api/repair-order-changes';

/** Typed hours as a number when they read as one; the schema says what is wrong otherwise. */
const asHours = (value: unknown) => (typeof value === 'string' ? (parseDecimal(value) ?? value) : value);

interface LineDialogProps {
  repairOrderId: number;
  onClose: () => void;
}

/** The advisor corrects a line: title, book hours and the three Cs. */
export function EditLineDialog({ repairOrderId, line, onClose }: LineDialogProps & { line: JobLineDto }) {
  const edit = useEditJobLine(repairOrderId);
  const form = useSchemaForm(editJobLineSchema, {
    defaultValues: {
      title: line.title,
      bookHours: line.bookHours,
      concern: line.concern,
      cause: line.cause ?? '',
      correction: line.correction ?? '',
    },
  });
  const { errors } = form.formState;
  return (
    <FormDialog
      title={`Edit ${lineWords(line.lineNo)}`}
      submitLabel="Save line"
      pending={edit.isPending}
      formError={errors.root?.server?.message}
      onClose={onClose}
      onSubmit={form.handleSubmit((body) =>
        edit.mutate(
          { lineId: line.id, body },
          { onSuccess: onClose, onError: (error) => showServerErrors(form, error) },
        ),
      )}
    >
      <Field label="Job" validationMessage={errors.title?.message}>
        <Input {...form.register('title')} />
      </Field>
      <Field label="Book hours" validationMessage={errors.bookHours?.message}>
        <Input inputMode="decimal" {...form.register('bookHours', { setValueAs: asHours })} />
      </Field>
      <Field label="Concern (the customer’s words)" validationMessage={errors.concern?.message}>
        <Textarea rows={2} {...form.register('concern')} />
      </Field>
      <Field label="Cause (what the technician found)" validationMessage={errors.cause?.message}>
        <Textarea rows={2} {...form.register('cause')} />
      </Field>
      <Field label="Correction (what was done)" validationMessage={errors.correction?.message}>
        <Textarea rows={2} {...form.register('correction')} />
      </Field>
    </FormDialog>
  );
}

/** A line added after the RO was written: it joins the dispatch queue. */
export function AddLineDialog({ repairOrderId, concern, onClose }: LineDialogProps & { concern: string }) {
  const add = useAddJobLine(repairOrderId);
  const form = useSchemaForm(addJobLineSchema, { defaultValues: { title: '', concern } });
  const { errors } = form.formState;
  return (
    <FormDialog
      title="Add a job line"
      submitLabel="Add line"
      pending={add.isPending}
      formError={errors.root?.server?.message}
      onClose={onClose}
      onSubmit={form.handleSubmit((body) =>
        add.mutate(body, { onSuccess: onClose, onError: (error) => showServerErrors(form, error) }),
      )}
    >
      <Field label="Job" required validationMessage={errors.title?.message}>
        <Input {...form.register('title')} />
      </Field>
      <Field label="Book hours" required validationMessage={errors.bookHours?.message}>
        <Input inputMode="decimal" {...form.register('bookHours', { setValueAs: asHours })} />
      </Field>
      <Field label="Concern (the customer’s words)" validationMessage={errors.concern?.message}>
        <Textarea rows={2} {...form.register('concern')} />
      </Field>
    </FormDialog>
  );
}

/** A line with time on it is never deleted: it is cancelled, with a reason. */
export function CancelLineDialog({ repairOrderId, line, onClose }: LineDialogProps & { line: JobLineDto }) {
  const cancel = useCancelJobLine(repairOrderId);
  const form = useSchemaForm(cancelJobLineSchema, { defaultValues: { reason: '' } });
  const { errors } = form.formState;
  return (
    <FormDialog
      title={`Cancel ${lineWithTitleWords(line.lineNo, line.title)}`}
      submitLabel="Cancel the line"
      pending={cancel.isPending}
      formError={errors.root?.server?.message}
      onClose={onClose}
      onSubmit={form.handleSubmit((body) =>
        cancel.mutate(
          { lineId: line.id, body },
          { onSuccess: onClose, onError: (error) => showServerErrors(form, error) },
        ),
      )}
    >
      <Field
        label="Why is it cancelled?"
        required
        hint="The line and its clocked time stay on the RO; it is never flagged."
        validationMessage={errors.reason?.message}
      >
        <Textarea rows={3} {...form.register('reason')} />
      </Field>
    </FormDialog>
  );
}
