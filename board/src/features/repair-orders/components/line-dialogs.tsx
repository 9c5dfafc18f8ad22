import { useState } from 'react';
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
import { ConfirmDialog } from '@/components/confirm-dialog';
import { FormDialog } from '@/components/form-dialog';
import { formErrorText } from '@/lib/form-errors';
import { showServerErrors, useSchemaForm } from '@/lib/form';
import {
  isStaleEdit,
  useAddJobLine,
  useCancelJobLine,
  useEditJobLine,
  useReloadRepairOrder,
  useReopenJobLine,
} from '../api/repair-order-changes';
import { changedFields, keepEditsOnReload, readFields } from '../ro-model';
import { ReloadedBar, StaleEditBar, replacedWords, type ReplacedWords } from './edit-repair-order-dialog';

/** Typed hours as a number when they read as one; the schema says what is wrong otherwise. */
const asHours = (value: unknown) => (typeof value === 'string' ? (parseDecimal(value) ?? value) : value);

interface LineDialogProps {
  repairOrderId: number;
  onClose: () => void;
}

/** The form's fields as the line was read. */
const lineFieldsOf = (line: JobLineDto) => ({
  title: line.title,
  bookHours: line.bookHours,
  concern: line.concern,
  cause: line.cause ?? '',
  correction: line.correction ?? '',
});

const LINE_FIELD_LABELS: Readonly<Record<string, string>> = {
  title: 'Job',
  bookHours: 'Book hours',
  concern: 'Concern',
  cause: 'Cause',
  correction: 'Correction',
};

/** The advisor corrects a line: title, book hours and the three Cs. */
export function EditLineDialog({ repairOrderId, line, onClose }: LineDialogProps & { line: JobLineDto }) {
  const edit = useEditJobLine(repairOrderId);
  const reload = useReloadRepairOrder(repairOrderId);
  const [lineNo, setLineNo] = useState(line.lineNo);
  const [opened, setOpened] = useState(() => lineFieldsOf(line));
  const form = useSchemaForm(editJobLineSchema, { defaultValues: opened });
  const [stale, setStale] = useState<string | null>(null);
  const [reloading, setReloading] = useState(false);
  const [reloaded, setReloaded] = useState<{ keptAny: boolean; replaced: ReplacedWords[] } | null>(null);
  const { errors } = form.formState;

  const readAgain = () => {
    const edited = form.getValues();
    setReloading(true);
    reload()
      .then((ro) => {
        const fresh = ro.lines.find((l) => l.id === line.id);
        // Removed meanwhile: the page shows it gone.
        if (!fresh) return onClose();
        const merged = keepEditsOnReload(opened, edited, lineFieldsOf(fresh));
        setLineNo(fresh.lineNo);
        setOpened(lineFieldsOf(fresh));
        form.reset(merged.values);
        setStale(null);
        setReloaded({
          keptAny: merged.kept.length > 0,
          replaced: replacedWords(merged.replaced, LINE_FIELD_LABELS),
        });
      })
      .catch((error: unknown) => showServerErrors(form, error))
      .finally(() => setReloading(false));
  };

  return (
    <FormDialog
      title={`Edit ${lineWords(lineNo)}`}
      submitLabel="Save line"
      pending={edit.isPending || reloading}
      formError={errors.root?.server?.message}
      onClose={onClose}
      onSubmit={form.handleSubmit((edited) => {
        const openedFields = editJobLineSchema.safeParse(opened).data ?? {};
        const body = changedFields(openedFields, edited);
        if (Object.keys(body).length === 0) return onClose();
        edit.mutate(
          { lineId: line.id, body: { ...body, was: readFields(openedFields, body) } },
          {
            onSuccess: onClose,
            onError: (error) => {
              if (!isStaleEdit(error)) return showServerErrors(form, error);
              setReloaded(null);
              setStale(error.message);
            },
          },
        );
      })}
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
      {stale && <StaleEditBar message={stale} reloading={reloading} onReload={readAgain} />}
      {reloaded && <ReloadedBar {...reloaded} />}
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

/** A comeback: the finished line is worked again, and its flagged hours follow it. */
export function ReopenLineDialog({ repairOrderId, line, onClose }: LineDialogProps & { line: JobLineDto }) {
  const reopen = useReopenJobLine(repairOrderId);
  return (
    <ConfirmDialog
      title={`Reopen ${lineWithTitleWords(line.lineNo, line.title)}?`}
      confirmLabel="Reopen the line"
      pendingLabel="Reopening…"
      keepLabel="Keep it done"
      pending={reopen.isPending}
      error={reopen.error ? formErrorText(reopen.error) : null}
      onConfirm={() => reopen.mutate(line.id, { onSuccess: onClose })}
      onClose={onClose}
    >
      The line goes back to the dispatch queue as a comeback, to be assigned and worked again, and the history
      records it as opened again. Its book hours are no longer flagged as done; any already paid for a closed
      pay week are adjusted in the next open pay week.
    </ConfirmDialog>
  );
}
