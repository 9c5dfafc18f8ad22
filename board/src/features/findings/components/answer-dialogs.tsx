import { Controller, type Control, type FieldValues, type Path } from 'react-hook-form';
import {
  Field,
  Input,
  Radio,
  RadioGroup,
  Text,
  Textarea,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import {
  changeFindingAnswerSchema,
  findingAnswerSchema,
  type FindingAnswerResult,
  type FindingDto,
} from '@baytime/shared';
import { FormDialog } from '@/components/form-dialog';
import { showServerErrors, useSchemaForm } from '@/lib/form';
import { useAnswerFinding, useChangeFindingAnswer } from '../api/answer-finding';
import { parseHours, titleHint } from '../findings-model';

const useStyles = makeStyles({
  context: { color: tokens.colorNeutralForeground2 },
  hours: { maxWidth: '10rem' },
});

/** Hours typed as "1,5" or "1.5"; the schema says what is wrong with anything else. */
const asHours = (value: unknown) => (typeof value === 'string' ? (parseHours(value) ?? value) : value);
/** An optional text left empty is left out. */
const emptyAsMissing = (value: unknown) =>
  typeof value === 'string' && value.trim() === '' ? undefined : value;

/** How the answer reached the office: the link records its own, so here it is by phone or in person. */
function ChannelField<Values extends FieldValues & { channel?: unknown }>({
  control,
}: {
  control: Control<Values>;
}) {
  return (
    <Controller
      control={control}
      name={'channel' as Path<Values>}
      render={({ field, fieldState }) => (
        <Field label="How did the customer answer?" required validationMessage={fieldState.error?.message}>
          <RadioGroup
            layout="horizontal"
            name={field.name}
            value={typeof field.value === 'string' ? field.value : ''}
            onChange={(_, data) => field.onChange(data.value)}
          >
            <Radio value="phone" label="By phone" />
            <Radio value="in-person" label="In person" />
          </RadioGroup>
        </Field>
      )}
    />
  );
}

interface AnswerDialogProps {
  finding: FindingDto;
  onClose: () => void;
  onDone: (result: FindingAnswerResult) => void;
}

/** "Customer approved": the book hours for a new line (the tech's suggestion to start with) and its title. */
export function ApproveDialog({ finding, onClose, onDone }: AnswerDialogProps) {
  const styles = useStyles();
  const answer = useAnswerFinding();
  const form = useSchemaForm(findingAnswerSchema, {
    defaultValues: {
      answer: 'approved',
      bookHours: finding.bookHours ?? finding.suggestedHours ?? undefined,
    },
  });
  const errors = form.formState.errors as { bookHours?: { message?: string }; title?: { message?: string } };
  return (
    <FormDialog
      title="Customer approved"
      submitLabel="Add the line"
      pending={answer.isPending}
      formError={form.formState.errors.root?.server?.message}
      onClose={onClose}
      onSubmit={form.handleSubmit((body) =>
        answer.mutate(
          { id: finding.id, body },
          { onSuccess: onDone, onError: (error) => showServerErrors(form, error) },
        ),
      )}
    >
      <Text className={styles.context}>
        Adds a new job line to RO {finding.repairOrderNumber} ({finding.vehicle}), queued for the foreman to
        assign.
      </Text>
      <ChannelField control={form.control} />
      <Field
        label="Book hours to charge"
        required
        validationMessage={errors.bookHours?.message}
        hint={
          finding.suggestedHours === null
            ? 'The technician suggested no time.'
            : `${finding.technicianName} suggested ${finding.suggestedHours} h.`
        }
      >
        <Input
          className={styles.hours}
          inputMode="decimal"
          autoFocus
          {...form.register('bookHours', { setValueAs: asHours })}
        />
      </Field>
      <Field
        label="Title of the new line"
        validationMessage={errors.title?.message}
        hint="Leave empty to use the technician’s note."
      >
        <Input
          maxLength={120}
          placeholder={titleHint(finding.customerWording ?? finding.note)}
          {...form.register('title', { setValueAs: emptyAsMissing })}
        />
      </Field>
    </FormDialog>
  );
}

/** "Customer declined", with what they said if anything; it goes on the ready notice as declined work. */
export function DeclineDialog({ finding, onClose, onDone }: AnswerDialogProps) {
  const styles = useStyles();
  const answer = useAnswerFinding();
  const form = useSchemaForm(findingAnswerSchema, { defaultValues: { answer: 'declined' } });
  const errors = form.formState.errors as { note?: { message?: string } };
  return (
    <FormDialog
      title="Customer declined"
      submitLabel="Record the answer"
      pending={answer.isPending}
      formError={form.formState.errors.root?.server?.message}
      onClose={onClose}
      onSubmit={form.handleSubmit((body) =>
        answer.mutate(
          { id: finding.id, body },
          { onSuccess: onDone, onError: (error) => showServerErrors(form, error) },
        ),
      )}
    >
      <Text className={styles.context}>
        No line is added to RO {finding.repairOrderNumber}. The finding is listed on the customer’s ready
        notice as work they chose not to have done.
      </Text>
      <ChannelField control={form.control} />
      <Field label="What the customer said" validationMessage={errors.note?.message} hint="Optional.">
        <Textarea
          maxLength={500}
          resize="vertical"
          autoFocus
          placeholder="e.g. Will book it in next month"
          {...form.register('note', { setValueAs: emptyAsMissing })}
        />
      </Field>
    </FormDialog>
  );
}

/**
 * The customer changed their mind, or the answer was recorded wrong: the other answer, with a reason.
 * A yes turned into a no cancels the line the yes added.
 */
export function ChangeAnswerDialog({ finding, onClose, onDone }: AnswerDialogProps) {
  const styles = useStyles();
  const change = useChangeFindingAnswer();
  const toApproved = finding.answer === 'declined';
  const form = useSchemaForm(changeFindingAnswerSchema, {
    defaultValues: toApproved
      ? {
          answer: 'approved',
          bookHours: finding.bookHours ?? finding.suggestedHours ?? undefined,
          reason: '',
        }
      : { answer: 'declined', reason: '' },
  });
  const errors = form.formState.errors as { bookHours?: { message?: string }; reason?: { message?: string } };
  return (
    <FormDialog
      title={toApproved ? 'Change to approved' : 'Change to declined'}
      submitLabel="Change the answer"
      pending={change.isPending}
      formError={form.formState.errors.root?.server?.message}
      onClose={onClose}
      onSubmit={form.handleSubmit((body) =>
        change.mutate(
          { id: finding.id, body },
          { onSuccess: onDone, onError: (error) => showServerErrors(form, error) },
        ),
      )}
    >
      <Text className={styles.context}>
        {toApproved
          ? `Adds the work to RO ${finding.repairOrderNumber} as a new queued line.`
          : `Cancels the line the approval added to RO ${finding.repairOrderNumber}; once that work is done the answer stays.`}
      </Text>
      <ChannelField control={form.control} />
      {toApproved && (
        <Field label="Book hours to charge" required validationMessage={errors.bookHours?.message}>
          <Input
            className={styles.hours}
            inputMode="decimal"
            {...form.register('bookHours', { setValueAs: asHours })}
          />
        </Field>
      )}
      <Field label="Why the answer changes" required validationMessage={errors.reason?.message}>
        <Textarea rows={2} {...form.register('reason')} />
      </Field>
    </FormDialog>
  );
}
