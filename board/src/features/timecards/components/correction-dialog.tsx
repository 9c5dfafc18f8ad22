import { useState, type FormEvent } from 'react';
import {
  Button,
  Caption1,
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
  Select,
  Textarea,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import {
  BREAK_KINDS,
  PUNCH_KINDS,
  correctionSchema,
  shopLocalInstant,
  voidPunchSchema,
  type BreakKind,
  type CorrectionBody,
  type CorrectionPreview,
  type DisplacedPunch,
  type PunchKind,
  type Timecard,
  type TimecardPunch,
} from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { formErrorText, issuesToFieldErrors, type FieldErrors } from '@/lib/form-errors';
import { useCreateCorrection } from '../api/create-correction';
import { useOpenLines } from '../api/get-open-lines';
import { usePreviewCorrection } from '../api/preview-correction';
import { usePreviewVoidPunch, useVoidPunch } from '../api/void-punch';
import {
  BREAK_WORDS,
  PUNCH_WORDS,
  clockValue,
  dayValue,
  formatDay,
  formatHours,
  formatDayClock,
} from '../timecard-format';
import { jobLineChoices } from '../timecard-model';

export type CorrectionTarget = { replace: TimecardPunch } | { add: true };

interface Draft {
  kind: PunchKind;
  day: string;
  time: string;
  breakKind: BreakKind;
  jobLineId: string;
  reason: string;
}

const useStyles = makeStyles({
  surface: { maxWidth: '36rem' },
  content: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  when: { display: 'grid', gridTemplateColumns: '1fr 9rem', gap: tokens.spacingHorizontalM },
  replaces: {
    padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalM}`,
    borderRadius: tokens.borderRadiusMedium,
    backgroundColor: tokens.colorNeutralBackground3,
  },
  displaced: { margin: `${tokens.spacingVerticalXS} 0 0`, paddingLeft: tokens.spacingHorizontalL },
});

const needsLine = (kind: PunchKind) => kind === 'job-on' || kind === 'job-off';

function startDraft(card: Timecard, target: CorrectionTarget): Draft {
  if ('replace' in target) {
    const punch = target.replace;
    return {
      kind: punch.kind,
      day: dayValue(punch.at, card.timeZone),
      time: clockValue(punch.at, card.timeZone),
      breakKind: punch.breakKind ?? 'meal',
      jobLineId: punch.jobLineId === null ? '' : String(punch.jobLineId),
      reason: '',
    };
  }
  const today = dayValue(new Date(), card.timeZone);
  const inWeek = card.days.some((day) => day.day === today);
  return {
    kind: 'shift-out',
    day: inWeek ? today : (card.days.at(-1)?.day ?? today),
    time: '',
    breakKind: 'meal',
    jobLineId: '',
    reason: '',
  };
}

/**
 * Replace one punch, or add one that was missed; the reason is kept on the card with the editor's name.
 * Kept mounted and driven by `open`: a modal unmounted while open leaves the page hidden from assistive
 * technology.
 */
export function CorrectionDialog({
  open,
  card,
  target,
  onClose,
  onSaved,
}: {
  open: boolean;
  card: Timecard;
  target: CorrectionTarget;
  onClose: () => void;
  onSaved: (message: string) => void;
}) {
  const styles = useStyles();
  const save = useCreateCorrection();
  const preview = usePreviewCorrection();
  const takeOut = useVoidPunch();
  const previewTakeOut = usePreviewVoidPunch();
  const pending = [save, preview, takeOut, previewTakeOut].some((call) => call.isPending);
  const [draft, setDraft] = useState<Draft>(() => startDraft(card, target));
  /** What the preview said goes with the change, once shown: saving then confirms it. */
  const [shown, setShown] = useState<CorrectionPreview | null>(null);
  const displaced = shown?.displaces ?? [];
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const replacing = 'replace' in target ? target.replace : null;
  /** A wrong punch (a tap on the wrong line) is taken out with nothing in its place. */
  const [takingOut, setTakingOut] = useState(false);
  const openLines = useOpenLines(needsLine(draft.kind));
  const choices = jobLineChoices(card, openLines.data ?? []);

  const set = <K extends keyof Draft>(key: K, value: Draft[K]) => {
    setDraft((current) => ({ ...current, [key]: value }));
    setErrors((current) => ({ ...current, [key === 'day' ? 'time' : key]: undefined }));
    setFormError(null);
    setShown(null);
  };

  const onSaveError = (error: Error) => {
    if (error instanceof ApiError && Object.keys(error.fieldErrors).length) {
      const server = { ...error.fieldErrors } as FieldErrors;
      if (server.at) server.time = server.at;
      setErrors(server);
      if (
        !Object.keys(server).some((key) => ['kind', 'time', 'jobLineId', 'breakKind', 'reason'].includes(key))
      )
        setFormError(error.message);
      return;
    }
    setFormError(formErrorText(error));
  };

  const store = (body: CorrectionBody) => {
    save.mutate(body, {
      onSuccess: () => {
        onSaved(
          replacing
            ? `${PUNCH_WORDS[replacing.kind]} replaced. The old punch stays on the card, struck through.`
            : `${PUNCH_WORDS[draft.kind]} added for ${formatDay(draft.day)}.`,
        );
      },
      onError: onSaveError,
    });
  };

  /**
   * A change that would make other counted punches impossible shows them before it is saved; saved, it
   * names them (`displaces`) so that the server takes out exactly what was shown.
   */
  const checkThenSave = <Body extends { displaces?: string[] }>(
    body: Body,
    check: (
      body: Body,
      handlers: { onSuccess: (answer: CorrectionPreview) => void; onError: (error: Error) => void },
    ) => void,
    saveIt: (body: Body) => void,
  ) => {
    if (shown) return saveIt({ ...body, displaces: displaced.map((punch) => punch.id) });
    check(body, {
      onSuccess: (answer) => {
        if (answer.refusal) setFormError(`That change does not fit the timecard: ${answer.refusal}`);
        else if (answer.displaces.length > 0 || answer.withIt.length > 0) setShown(answer);
        else saveIt(body);
      },
      onError: (error) => setFormError(formErrorText(error)),
    });
  };

  const submitTakeOut = (punch: TimecardPunch) => {
    const parsed = voidPunchSchema.safeParse({
      punchId: punch.id,
      technicianId: card.technician.id,
      reason: draft.reason,
    });
    if (!parsed.success) return setErrors(issuesToFieldErrors(parsed.error.issues));
    checkThenSave(parsed.data, previewTakeOut.mutate, (body) =>
      takeOut.mutate(body, {
        onSuccess: () =>
          onSaved(`${PUNCH_WORDS[punch.kind]} taken out of the count. It stays on the card, struck through.`),
        onError: onSaveError,
      }),
    );
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    if (replacing && takingOut) return submitTakeOut(replacing);
    const local: FieldErrors = {};
    let at = '';
    if (!/^\d{2}:\d{2}$/.test(draft.time)) local.time = 'Enter the time, like 07:30';
    else {
      const instant = shopLocalInstant(draft.day, draft.time, card.timeZone);
      if (instant.getTime() > Date.now()) local.time = 'That time has not come yet';
      at = instant.toISOString();
    }
    const body = {
      ...(replacing ? { punchId: replacing.id } : {}),
      technicianId: card.technician.id,
      kind: draft.kind,
      at,
      ...(needsLine(draft.kind) && draft.jobLineId ? { jobLineId: Number(draft.jobLineId) } : {}),
      ...(draft.kind === 'break-start' ? { breakKind: draft.breakKind } : {}),
      reason: draft.reason,
    };
    const parsed = correctionSchema.safeParse(body);
    const schemaErrors = parsed.success ? {} : issuesToFieldErrors(parsed.error.issues);
    if (needsLine(draft.kind) && !draft.jobLineId) local.jobLineId = 'Choose the job line';
    const all: FieldErrors = { ...schemaErrors, ...local };
    if (all.at) all.time ??= all.at;
    if (!parsed.success || Object.values(local).some(Boolean)) return setErrors(all);
    checkThenSave(parsed.data, preview.mutate, store);
  };

  return (
    <Dialog open={open} onOpenChange={(_, data) => !data.open && onClose()} modalType="modal">
      <DialogSurface className={styles.surface}>
        <form onSubmit={submit} noValidate>
          <DialogBody>
            <DialogTitle>{replacing ? 'Correct a punch' : 'Add a missed punch'}</DialogTitle>
            <DialogContent className={styles.content}>
              <Caption1>
                {card.technician.name} · times in the shop’s time zone ({card.timeZone})
              </Caption1>
              {replacing && (
                <>
                  <div className={styles.replaces}>
                    {takingOut ? 'Takes out' : 'Replaces'}{' '}
                    <strong>{PUNCH_WORDS[replacing.kind].toLowerCase()}</strong> at{' '}
                    {formatDayClock(replacing.at, card.timeZone)}
                    {takingOut
                      ? replacing.kind === 'job-on'
                        ? ', with any clock-offs it recorded for lines it closed, and puts nothing in its place.'
                        : ' and puts nothing in its place.'
                      : '.'}{' '}
                    The old punch stays on the card, struck through.
                  </div>
                  <Field label="What to do">
                    <RadioGroup
                      value={takingOut ? 'take-out' : 'replace'}
                      onChange={(_, data) => {
                        setTakingOut(data.value === 'take-out');
                        setShown(null);
                        setFormError(null);
                      }}
                    >
                      <Radio value="replace" label="Replace it with the right punch" />
                      <Radio value="take-out" label="Take it out: it should never have been punched" />
                    </RadioGroup>
                  </Field>
                </>
              )}
              {!takingOut && (
                <>
                  <Field label="Punch" required validationMessage={errors.kind}>
                    <Select value={draft.kind} onChange={(_, data) => set('kind', data.value as PunchKind)}>
                      {PUNCH_KINDS.map((kind) => (
                        <option key={kind} value={kind}>
                          {PUNCH_WORDS[kind]}
                        </option>
                      ))}
                    </Select>
                  </Field>
                  <div className={styles.when}>
                    <Field label="Day" required>
                      <Select value={draft.day} onChange={(_, data) => set('day', data.value)}>
                        {card.days.map((day) => (
                          <option key={day.day} value={day.day}>
                            {formatDay(day.day)}
                          </option>
                        ))}
                      </Select>
                    </Field>
                    <Field label="Time" required validationMessage={errors.time}>
                      <Input type="time" value={draft.time} onChange={(_, data) => set('time', data.value)} />
                    </Field>
                  </div>
                  {draft.kind === 'break-start' && (
                    <Field label="Kind of break" required validationMessage={errors.breakKind}>
                      <RadioGroup
                        layout="horizontal"
                        value={draft.breakKind}
                        onChange={(_, data) => set('breakKind', data.value as BreakKind)}
                      >
                        {BREAK_KINDS.map((kind) => (
                          <Radio key={kind} value={kind} label={BREAK_WORDS[kind]} />
                        ))}
                      </RadioGroup>
                    </Field>
                  )}
                  {needsLine(draft.kind) && (
                    <Field
                      label="Job line"
                      required
                      validationMessage={errors.jobLineId}
                      hint={openLines.isPending ? 'Loading the open repair orders…' : undefined}
                    >
                      <Select value={draft.jobLineId} onChange={(_, data) => set('jobLineId', data.value)}>
                        <option value="">Choose…</option>
                        {choices.map((line) => (
                          <option key={line.jobLineId} value={line.jobLineId}>
                            {line.label}
                          </option>
                        ))}
                      </Select>
                    </Field>
                  )}
                </>
              )}
              <Field
                label="Reason"
                required
                validationMessage={errors.reason}
                hint="Kept on the card with your name and the time of the change."
              >
                <Textarea
                  value={draft.reason}
                  maxLength={500}
                  resize="vertical"
                  placeholder={
                    takingOut
                      ? 'e.g. Tapped the wrong line'
                      : 'e.g. Forgot to badge out at the end of the shift'
                  }
                  onChange={(_, data) => set('reason', data.value)}
                />
              </Field>
              {shown && shown.withIt.length > 0 && (
                <MessageBar intent="info" layout="multiline">
                  <MessageBarBody>
                    {takingOut
                      ? 'Taken out with it, as its clock-on recorded them:'
                      : 'Recorded with it, as the shop’s limit of jobs at once closes these lines:'}
                    <PunchList punches={shown.withIt} className={styles.displaced} />
                  </MessageBarBody>
                </MessageBar>
              )}
              {displaced.length > 0 && (
                <MessageBar intent="warning" layout="multiline">
                  <MessageBarBody>
                    This change would leave these punches without a place on the card; saving it takes them
                    out of the count, each on record with your reason:
                    <PunchList punches={displaced} className={styles.displaced} />
                  </MessageBarBody>
                </MessageBar>
              )}
              {shown && (shown.change.attendanceSeconds !== 0 || shown.change.clockedSeconds !== 0) && (
                <Caption1>
                  On the card: attendance {signedHours(shown.change.attendanceSeconds)}, on jobs{' '}
                  {signedHours(shown.change.clockedSeconds)}.
                </Caption1>
              )}
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
              <Button appearance="primary" type="submit" disabled={pending}>
                {pending
                  ? 'Checking…'
                  : displaced.length > 0
                    ? `Save and take ${displaced.length} punch${displaced.length === 1 ? '' : 'es'} out`
                    : shown
                      ? 'Confirm and save'
                      : takingOut
                        ? 'Take punch out'
                        : replacing
                          ? 'Save correction'
                          : 'Add punch'}
              </Button>
            </DialogActions>
          </DialogBody>
        </form>
      </DialogSurface>
    </Dialog>
  );
}

function PunchList({ punches, className }: { punches: DisplacedPunch[]; className: string }) {
  return (
    <ul className={className}>
      {punches.map((punch) => (
        <li key={punch.id}>{punch.words.replace(/^the /, 'The ')}</li>
      ))}
    </ul>
  );
}

/** "−0.83 h", "+0.5 h", "0 h": a change of counted time. */
const signedHours = (seconds: number) =>
  `${seconds < 0 ? '−' : seconds > 0 ? '+' : ''}${formatHours(Math.abs(seconds))}`;
