import { useState, type FormEvent } from 'react';
import {
  Button,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  Field,
  Input,
  MessageBar,
  MessageBarBody,
  Radio,
  RadioGroup,
  Text,
  Textarea,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import {
  findingAnswerSchema,
  type FindingAnswerResult,
  type FindingDto,
  type OfficeAnswerChannel,
} from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { formErrorText, issuesToFieldErrors, type FieldErrors } from '@/lib/form-errors';
import { useAnswerFinding } from '../api/answer-finding';
import { parseHours, titleHint } from '../findings-model';

const useStyles = makeStyles({
  surface: { maxWidth: '34rem' },
  content: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  context: { color: tokens.colorNeutralForeground2 },
  hours: { maxWidth: '10rem' },
});

function serverErrors(
  error: unknown,
  known: readonly string[],
): { fields: FieldErrors; form: string | null } {
  if (error instanceof ApiError && Object.keys(error.fieldErrors).length) {
    const fields = error.fieldErrors as FieldErrors;
    return { fields, form: Object.keys(fields).some((key) => known.includes(key)) ? null : error.message };
  }
  return { fields: {}, form: formErrorText(error) };
}

/** How the answer reached the office: the link records its own, so here it is by phone or in person. */
function ChannelField({
  value,
  error,
  onChange,
}: {
  value: OfficeAnswerChannel | '';
  error: string | undefined;
  onChange: (value: OfficeAnswerChannel) => void;
}) {
  return (
    <Field label="How did the customer answer?" required validationMessage={error}>
      <RadioGroup
        layout="horizontal"
        value={value}
        onChange={(_, data) => onChange(data.value as OfficeAnswerChannel)}
      >
        <Radio value="phone" label="By phone" />
        <Radio value="in-person" label="In person" />
      </RadioGroup>
    </Field>
  );
}

/** "Customer approved": the book hours for a new line (the tech's suggestion to start with) and its title. */
export function ApproveDialog({
  finding,
  onClose,
  onDone,
}: {
  finding: FindingDto;
  onClose: () => void;
  onDone: (result: FindingAnswerResult) => void;
}) {
  const styles = useStyles();
  const answer = useAnswerFinding();
  const [hours, setHours] = useState(String(finding.bookHours ?? finding.suggestedHours ?? ''));
  const [title, setTitle] = useState('');
  const [channel, setChannel] = useState<OfficeAnswerChannel | ''>('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    const bookHours = parseHours(hours);
    const parsed = findingAnswerSchema.safeParse({
      answer: 'approved',
      channel: channel || undefined,
      bookHours: bookHours ?? undefined,
      ...(title.trim() ? { title: title.trim() } : {}),
    });
    if (!parsed.success) {
      const found = issuesToFieldErrors(parsed.error.issues);
      if (hours.trim() && bookHours === null) found.bookHours = 'Type the hours as a number, like 1.5';
      return setErrors(found);
    }
    answer.mutate(
      { id: finding.id, body: parsed.data },
      {
        onSuccess: onDone,
        onError: (error) => {
          const { fields, form } = serverErrors(error, ['bookHours', 'title', 'channel']);
          setErrors(fields);
          setFormError(form);
        },
      },
    );
  };

  return (
    <Dialog open onOpenChange={(_, data) => !data.open && onClose()}>
      <DialogSurface className={styles.surface}>
        <form onSubmit={submit} noValidate>
          <DialogBody>
            <DialogTitle>Customer approved</DialogTitle>
            <DialogContent className={styles.content}>
              <Text className={styles.context}>
                Adds a new job line to RO {finding.repairOrderNumber} ({finding.vehicle}), queued for the
                foreman to assign.
              </Text>
              <ChannelField
                value={channel}
                error={errors.channel}
                onChange={(value) => {
                  setChannel(value);
                  setErrors((current) => ({ ...current, channel: undefined }));
                }}
              />
              <Field
                label="Book hours to charge"
                required
                validationMessage={errors.bookHours}
                hint={
                  finding.suggestedHours === null
                    ? 'The technician suggested no time.'
                    : `${finding.technicianName} suggested ${finding.suggestedHours} h.`
                }
              >
                <Input
                  className={styles.hours}
                  value={hours}
                  inputMode="decimal"
                  autoFocus
                  onChange={(_, data) => {
                    setHours(data.value);
                    setErrors((current) => ({ ...current, bookHours: undefined }));
                  }}
                />
              </Field>
              <Field
                label="Title of the new line"
                validationMessage={errors.title}
                hint="Leave empty to use the technician’s note."
              >
                <Input
                  value={title}
                  maxLength={120}
                  placeholder={titleHint(finding.customerWording ?? finding.note)}
                  onChange={(_, data) => {
                    setTitle(data.value);
                    setErrors((current) => ({ ...current, title: undefined }));
                  }}
                />
              </Field>
              {formError && (
                <MessageBar intent="error" layout="multiline">
                  <MessageBarBody>{formError}</MessageBarBody>
                </MessageBar>
              )}
            </DialogContent>
            <DialogActions>
              <Button type="button" onClick={onClose}>
                Cancel
              </Button>
              <Button appearance="primary" type="submit" disabled={answer.isPending}>
                {answer.isPending ? 'Adding the line…' : 'Add the line'}
              </Button>
            </DialogActions>
          </DialogBody>
        </form>
      </DialogSurface>
    </Dialog>
  );
}

/** "Customer declined", with what they said if anything; it goes on the ready notice as declined work. */
export function DeclineDialog({
  finding,
  onClose,
  onDone,
}: {
  finding: FindingDto;
  onClose: () => void;
  onDone: (result: FindingAnswerResult) => void;
}) {
  const styles = useStyles();
  const answer = useAnswerFinding();
  const [note, setNote] = useState('');
  const [channel, setChannel] = useState<OfficeAnswerChannel | ''>('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    const parsed = findingAnswerSchema.safeParse({
      answer: 'declined',
      channel: channel || undefined,
      ...(note.trim() ? { note: note.trim() } : {}),
    });
    if (!parsed.success) return setErrors(issuesToFieldErrors(parsed.error.issues));
    answer.mutate(
      { id: finding.id, body: parsed.data },
      {
        onSuccess: onDone,
        onError: (error) => {
          const { fields, form } = serverErrors(error, ['note', 'channel']);
          setErrors(fields);
          setFormError(form);
        },
      },
    );
  };

  return (
    <Dialog open onOpenChange={(_, data) => !data.open && onClose()}>
      <DialogSurface className={styles.surface}>
        <form onSubmit={submit} noValidate>
          <DialogBody>
            <DialogTitle>Customer declined</DialogTitle>
            <DialogContent className={styles.content}>
              <Text className={styles.context}>
                No line is added to RO {finding.repairOrderNumber}. The finding is listed on the customer’s
                ready notice as work they chose not to have done.
              </Text>
              <ChannelField
                value={channel}
                error={errors.channel}
                onChange={(value) => {
                  setChannel(value);
                  setErrors((current) => ({ ...current, channel: undefined }));
                }}
              />
              <Field label="What the customer said" validationMessage={errors.note} hint="Optional.">
                <Textarea
                  value={note}
                  maxLength={500}
                  resize="vertical"
                  autoFocus
                  placeholder="e.g. Will book it in next month"
                  onChange={(_, data) => {
                    setNote(data.value);
                    setErrors((current) => ({ ...current, note: undefined }));
                  }}
                />
              </Field>
              {formError && (
                <MessageBar intent="error" layout="multiline">
                  <MessageBarBody>{formError}</MessageBarBody>
                </MessageBar>
              )}
            </DialogContent>
            <DialogActions>
              <Button type="button" onClick={onClose}>
                Cancel
              </Button>
              <Button appearance="primary" type="submit" disabled={answer.isPending}>
                {answer.isPending ? 'Saving…' : 'Record the answer'}
              </Button>
            </DialogActions>
          </DialogBody>
        </form>
      </DialogSurface>
    </Dialog>
  );
}
