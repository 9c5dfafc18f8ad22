import { FormErrorBar } from '@/components/form-error-bar';
import { useEffect, useId, useMemo, useRef, useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router';
import {
  Body1,
  Button,
  Caption1,
  Card,
  Field,
  Input,
  MessageBar,
  MessageBarActions,
  MessageBarBody,
  MessageBarTitle,
  Select,
  Subtitle2,
  Textarea,
  makeStyles,
  mergeClasses,
  tokens,
} from '@fluentui/react-components';
import { ApiError } from '@baytime/shared/client';
import {
  atStart,
  lineWords,
  normalizeVin,
  skillWords,
  type OpeningHours,
  type OperationDto,
} from '@baytime/shared';
import { paths } from '@/config/paths';
import { useMinuteNow } from '@/hooks/use-minute-now';
import { dateTimeFormat } from '@/lib/date-format';
import { formErrorText } from '@/lib/form-errors';
import { useCreateRepairOrder } from '../api/create-repair-order';
import { useKnownVehicle } from '../api/get-known-vehicle';
import { useOperations } from '@/lib/api/get-operations';
import { forgetIntakeDraft, keepIntakeDraft, restoreIntakeDraft, tabStorage } from '../intake-draft';
import {
  PROMISE_PASSED,
  bookHoursTotal,
  differsFromReturning,
  emptyDraft,
  emptyLine,
  formKey,
  lineFromOperation,
  parseWhole,
  promisedInstant,
  promiseChoices,
  toRepairOrder,
  vinFacts,
  vinNeedsReason,
  withReturningCustomer,
  type FieldErrors,
  type IntakeDraft,
  type LineDraft,
  type OverrideReasons,
} from '../intake-form';
import { OperationPicker } from './operation-picker';
import { VinInput } from './vin-input';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL, maxWidth: '90rem' },
  columns: {
    display: 'grid',
    gridTemplateColumns: 'repeat(2, minmax(0, 1fr))',
    gap: tokens.spacingHorizontalL,
    alignItems: 'start',
    '@media (max-width: 1100px)': { gridTemplateColumns: 'minmax(0, 1fr)' },
  },
  stack: { display: 'flex', flexDirection: 'column', gap: tokens.spacingHorizontalL },
  card: { padding: tokens.spacingHorizontalL, gap: tokens.spacingVerticalM },
  grid: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(11rem, 1fr))',
    gap: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalM}`,
    alignItems: 'start',
  },
  wide: { gridColumn: '1 / -1' },
  valid: { color: tokens.colorStatusSuccessForeground1, fontWeight: tokens.fontWeightSemibold },
  visit: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: tokens.spacingHorizontalS,
    padding: `${tokens.spacingVerticalXS} ${tokens.spacingHorizontalS}`,
    borderRadius: tokens.borderRadiusMedium,
    backgroundColor: tokens.colorNeutralBackground3,
  },
  override: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'flex-end',
    gap: tokens.spacingHorizontalM,
    padding: tokens.spacingHorizontalM,
    borderRadius: tokens.borderRadiusMedium,
    backgroundColor: tokens.colorStatusWarningBackground1,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorStatusWarningBorder1}`,
  },
  overrideField: { flexGrow: 1, minWidth: '16rem' },
  promised: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'flex-start' },
  choices: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS },
  dim: { color: tokens.colorNeutralForeground3 },
  linesHead: {
    display: 'flex',
    alignItems: 'baseline',
    justifyContent: 'space-between',
    gap: tokens.spacingHorizontalL,
  },
  line: {
    display: 'grid',
    gridTemplateColumns: '2.5rem minmax(14rem, 1fr) 7rem 8rem auto',
    gap: tokens.spacingHorizontalM,
    alignItems: 'start',
    '@media (max-width: 900px)': { gridTemplateColumns: '2.5rem minmax(0, 1fr) 6rem' },
  },
  lineNo: { paddingTop: '6px', fontWeight: tokens.fontWeightSemibold, fontVariantNumeric: 'tabular-nums' },
  remove: { marginTop: '1px' },
  total: { fontVariantNumeric: 'tabular-nums' },
  actions: { display: 'flex', gap: tokens.spacingHorizontalM, alignItems: 'center' },
});

const VISIT_DATE: Intl.DateTimeFormatOptions = { month: 'short', day: 'numeric', year: 'numeric' };

function timeZoneName(timeZone: string): string {
  try {
    return (
      new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'short' })
        .formatToParts(new Date())
        .find((part) => part.type === 'timeZoneName')?.value ?? timeZone
    );
  } catch {
    return timeZone;
  }
}

/** The first row's labels show as column heads; the others are for screen readers only. */
function rowLabel(index: number, visible: string, spoken: string) {
  return index === 0 ? visible : { children: `Line ${index + 1} ${spoken}`, className: 'visually-hidden' };
}

export interface RepairOrderFormProps {
  timeZone: string;
  openingHours: OpeningHours | undefined;
  units: 'metric' | 'us';
  /** Whose draft the tab keeps: another person signing in on it starts from an empty form. */
  userId: number;
}

/**
 * Writes a repair order: who, which vehicle, what they asked for, by when, and the job lines. What is
 * typed is kept in the tab until the RO is written or cancelled; clearing it starts a new form.
 */
export function RepairOrderForm(props: RepairOrderFormProps) {
  const [round, setRound] = useState(0);
  const startOver = () => {
    forgetIntakeDraft(tabStorage());
    setRound((n) => n + 1);
  };
  return <IntakeForm key={round} {...props} onStartOver={startOver} />;
}

function IntakeForm({
  timeZone,
  openingHours,
  units,
  userId,
  onStartOver,
}: RepairOrderFormProps & { onStartOver: () => void }) {
  const styles = useStyles();
  const navigate = useNavigate();
  const create = useCreateRepairOrder();
  const operations = useOperations();
  const formRef = useRef<HTMLFormElement>(null);
  // The promised field holds two inputs: each needs its own id, not the one the field hands out, and
  // its own name. Each names itself (aria-labelledby its own id reads its aria-label), or the field
  // would name both after its label.
  const promisedDateId = useId();
  const promisedTimeId = useId();

  const [restored] = useState(() => restoreIntakeDraft(tabStorage(), userId));
  const [draft, setDraft] = useState<IntakeDraft>(() => restored ?? emptyDraft());
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [autoYear, setAutoYear] = useState<string | null>(null);
  const [odometerRefused, setOdometerRefused] = useState(false);
  const [odometerReason, setOdometerReason] = useState('');
  // Offered only once a save was refused for a VIN outside the rules a reason can waive.
  const [vinRefused, setVinRefused] = useState(false);
  const [vinReason, setVinReason] = useState('');
  const [attempt, setAttempt] = useState(0);
  const [newLineKey, setNewLineKey] = useState<string | null>(null);

  const vin = vinFacts(draft.vehicle.vin);
  const vinText = normalizeVin(draft.vehicle.vin);
  const known =
    useKnownVehicle(vin.state === 'valid' || (vinRefused && vinText.length >= 5) ? vinText : null).data ??
    null;
  const lastOdometer = known?.lastOdometer ?? null;
  const typedOdometer = parseWhole(draft.vehicle.odometer);
  const lowerThanVisit = lastOdometer !== null && typedOdometer !== null && typedOdometer < lastOdometer;
  const [nowMs] = useState(() => Date.now());
  const minuteNow = useMinuteNow();
  const choices = useMemo(
    () => (openingHours ? promiseChoices(openingHours, timeZone, new Date(nowMs)) : []),
    [openingHours, timeZone, nowMs],
  );
  const zoneName = useMemo(() => timeZoneName(timeZone), [timeZone]);
  const unit = units === 'metric' ? 'km' : 'mi';
  const menu: readonly OperationDto[] = operations.data ?? [];

  useEffect(() => keepIntakeDraft(tabStorage(), userId, draft), [userId, draft]);

  // After a refused save, the first field to fix gets the keyboard focus.
  useEffect(() => {
    if (attempt === 0) return;
    const form = formRef.current;
    const target = vinRefused
      ? form?.querySelector<HTMLElement>('#vin-override-reason')
      : odometerRefused
        ? form?.querySelector<HTMLElement>('#odometer-override-reason')
        : form?.querySelector<HTMLElement>('[aria-invalid="true"]');
    target?.focus();
    // Only a new refused save moves the focus, not later edits.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [attempt]);

  const clear = (...keys: string[]) =>
    setErrors((current) => {
      const next = { ...current };
      for (const key of keys) delete next[key];
      return next;
    });

  const setCustomer = (key: keyof IntakeDraft['customer'], value: string) => {
    setDraft((d) => ({ ...d, customer: { ...d.customer, [key]: value } }));
    clear(`customer.${key}`);
  };

  const setVehicle = (key: keyof IntakeDraft['vehicle'], value: string) => {
    setDraft((d) => ({ ...d, vehicle: { ...d.vehicle, [key]: value } }));
    clear(`vehicle.${key}`);
    if (key === 'year') setAutoYear(null);
    if (key === 'odometer') setOdometerRefused(false);
  };

  const setVin = (value: string) => {
    const facts = vinFacts(value);
    setDraft((d) => {
      const year =
        facts.year !== null && (d.vehicle.year === '' || d.vehicle.year === autoYear)
          ? String(facts.year)
          : d.vehicle.year;
      return { ...d, vehicle: { ...d.vehicle, vin: value, year } };
    });
    if (facts.year !== null && (draft.vehicle.year === '' || draft.vehicle.year === autoYear)) {
      setAutoYear(String(facts.year));
      clear('vehicle.year');
    }
    clear('vehicle.vin', 'vinOverrideReason');
    if (normalizeVin(value) !== vinText) setVinRefused(false);
  };

  const setLine = (index: number, change: (line: LineDraft) => LineDraft, ...keys: string[]) => {
    setDraft((d) => ({ ...d, lines: d.lines.map((line, i) => (i === index ? change(line) : line)) }));
    clear(...keys.map((key) => `lines.${index}.${key}`), 'lines');
  };

  const addLine = () => {
    const line = emptyLine();
    setNewLineKey(line.key);
    setDraft((d) => ({ ...d, lines: [...d.lines, line] }));
    clear('lines');
  };

  const removeLine = (index: number) => {
    setDraft((d) => ({ ...d, lines: d.lines.filter((_, i) => i !== index) }));
    // Line errors are keyed by position: those after the removed line would point at the wrong row.
    setErrors((current) =>
      Object.fromEntries(Object.entries(current).filter(([key]) => !key.startsWith('lines.'))),
    );
  };

  const save = (reasons: OverrideReasons = {}) => {
    setFormError(null);
    const now = new Date();
    const result = toRepairOrder(draft, timeZone, reasons, now);
    if (!result.body) {
      setErrors(result.errors);
      if (!reasons.vin && vinNeedsReason(draft, timeZone, now)) setVinRefused(true);
      setAttempt((n) => n + 1);
      return;
    }
    setErrors({});
    create.mutate(result.body, {
      onSuccess: (ro) => {
        forgetIntakeDraft(tabStorage());
        void navigate(paths.repairOrder(ro.id), { state: { created: true } });
      },
      onError: (error) => {
        if (error instanceof ApiError && Object.keys(error.fieldErrors).length > 0) {
          const mapped: FieldErrors = {};
          for (const [key, message] of Object.entries(error.fieldErrors)) mapped[formKey(key)] = message;
          setErrors(mapped);
          if (mapped['vehicle.odometer'] && reasons.odometer === undefined) setOdometerRefused(true);
          setAttempt((n) => n + 1);
          return;
        }
        setFormError(formErrorText(error));
      },
    });
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (vinRefused || odometerRefused) saveWithReasons();
    else save();
  };

  /** Saves with every reason the advisor was asked for; a missing one is marked at its field. */
  const saveWithReasons = () => {
    const missing: FieldErrors = {};
    if (odometerRefused && odometerReason.trim().length < 3)
      missing.odometerOverrideReason = 'Say why, in a few words';
    if (vinRefused && vinReason.trim().length < 3) missing.vinOverrideReason = 'Say why, in a few words';
    if (Object.keys(missing).length) {
      setErrors((current) => ({ ...current, ...missing }));
      return;
    }
    save({
      odometer: odometerRefused ? odometerReason : undefined,
      vin: vinRefused ? vinReason : undefined,
    });
  };

  const errorCount = Object.values(errors).filter(Boolean).length;
  const total = bookHoursTotal(draft.lines);
  const promised = promisedInstant(draft.promisedDate, draft.promisedTime, timeZone);
  const promisedPassed = promised !== null && promised.getTime() <= minuteNow;

  return (
    <form ref={formRef} className={styles.form} onSubmit={submit} noValidate aria-label="New repair order">
      {restored && (
        <MessageBar intent="info">
          <MessageBarBody>
            <MessageBarTitle>Restored what you were typing</MessageBarTitle>
            Kept in this browser tab until the repair order is written or cancelled.
          </MessageBarBody>
          <MessageBarActions>
            <Button onClick={onStartOver}>Clear the form</Button>
          </MessageBarActions>
        </MessageBar>
      )}
      <div className={styles.columns}>
        <div className={styles.stack}>
          <Card className={styles.card}>
            <Subtitle2 as="h2">Customer</Subtitle2>
            <div className={styles.grid}>
              <Field
                label="Name"
                required
                validationMessage={errors['customer.name']}
                className={styles.wide}
              >
                <Input
                  value={draft.customer.name}
                  autoFocus
                  autoComplete="off"
                  onChange={(_, data) => setCustomer('name', data.value)}
                />
              </Field>
              <Field label="Phone" validationMessage={errors['customer.phone']}>
                <Input
                  type="tel"
                  value={draft.customer.phone}
                  autoComplete="off"
                  onChange={(_, data) => setCustomer('phone', data.value)}
                />
              </Field>
              <Field
                label="E-mail"
                validationMessage={errors['customer.email']}
                hint="For approvals and the ready notice"
              >
                <Input
                  type="email"
                  value={draft.customer.email}
                  autoComplete="off"
                  onChange={(_, data) => setCustomer('email', data.value)}
                />
              </Field>
            </div>
          </Card>

          <Card className={styles.card}>
            <Subtitle2 as="h2">Vehicle</Subtitle2>
            <div className={styles.grid}>
              <Field
                label="VIN"
                required
                className={styles.wide}
                validationMessage={
                  errors['vehicle.vin'] ??
                  (vin.state === 'invalid' || (vin.state === 'partial' && attempt > 0)
                    ? vin.message
                    : vin.state === 'valid'
                      ? vin.message
                      : undefined)
                }
                validationState={
                  errors['vehicle.vin'] || vin.state === 'invalid'
                    ? 'error'
                    : vin.state === 'valid'
                      ? 'success'
                      : 'none'
                }
                hint={
                  vin.state === 'partial' || vin.state === 'empty'
                    ? (vin.message ?? '17 characters, on the windscreen or door pillar')
                    : undefined
                }
              >
                <VinInput value={draft.vehicle.vin} onValueChange={setVin} />
              </Field>
              {vinRefused && (
                <div className={mergeClasses(styles.override, styles.wide)}>
                  <Field
                    className={styles.overrideField}
                    label="Built before 1981, or outside North America? Say why this VIN is right"
                    validationMessage={errors.vinOverrideReason}
                    hint="For example: imported, the maker uses no check digit. The reason is kept with the RO."
                  >
                    <Input
                      id="vin-override-reason"
                      value={vinReason}
                      onChange={(_, data) => {
                        setVinReason(data.value);
                        clear('vinOverrideReason');
                      }}
                    />
                  </Field>
                  <Button onClick={saveWithReasons} disabled={create.isPending}>
                    Save with this VIN
                  </Button>
                </div>
              )}
              {known && (
                <div className={mergeClasses(styles.visit, styles.wide)} role="status">
                  <Caption1>
                    Seen before:{' '}
                    {known.lastVisit
                      ? `RO ${known.lastVisit.number} on ${dateTimeFormat(timeZone, VISIT_DATE).format(new Date(known.lastVisit.date))}, `
                      : ''}
                    {known.year} {known.make} {known.model}
                    {known.plate ? ` (${known.plate})` : ''}, {known.customer.name}
                    {lastOdometer !== null ? `, ${lastOdometer.toLocaleString('en-US')} ${unit}` : ''}.
                  </Caption1>
                  {differsFromReturning(draft, known) && (
                    <Button
                      size="small"
                      onClick={() => {
                        setDraft((d) => withReturningCustomer(d, known));
                        setAutoYear(null);
                        clear(
                          'customer.name',
                          'customer.phone',
                          'customer.email',
                          'vehicle.year',
                          'vehicle.make',
                          'vehicle.model',
                          'vehicle.plate',
                        );
                      }}
                    >
                      Use {known.customer.name}’s details
                    </Button>
                  )}
                </div>
              )}
              <Field
                label="Model year"
                required
                validationMessage={errors['vehicle.year']}
                hint={autoYear && draft.vehicle.year === autoYear ? 'From the VIN' : undefined}
              >
                <Input
                  value={draft.vehicle.year}
                  inputMode="numeric"
                  maxLength={4}
                  onChange={(_, data) => setVehicle('year', data.value)}
                />
              </Field>
              <Field label="Make" required validationMessage={errors['vehicle.make']}>
                <Input value={draft.vehicle.make} onChange={(_, data) => setVehicle('make', data.value)} />
              </Field>
              <Field label="Model" required validationMessage={errors['vehicle.model']}>
                <Input value={draft.vehicle.model} onChange={(_, data) => setVehicle('model', data.value)} />
              </Field>
              <Field label="Plate" validationMessage={errors['vehicle.plate']}>
                <Input
                  value={draft.vehicle.plate}
                  onChange={(_, data) => setVehicle('plate', data.value.toUpperCase())}
                />
              </Field>
              <Field
                label={`Odometer (${unit})`}
                required
                validationMessage={
                  errors['vehicle.odometer'] ??
                  (lowerThanVisit && lastOdometer !== null
                    ? `Lower than the last visit (${lastOdometer.toLocaleString('en-US')}): check it`
                    : undefined)
                }
                validationState={errors['vehicle.odometer'] ? 'error' : lowerThanVisit ? 'warning' : 'none'}
              >
                <Input
                  value={draft.vehicle.odometer}
                  inputMode="numeric"
                  onChange={(_, data) => setVehicle('odometer', data.value)}
                />
              </Field>
              {odometerRefused && (
                <div className={mergeClasses(styles.override, styles.wide)}>
                  <Field
                    className={styles.overrideField}
                    label="Reading is right? Say why it is lower"
                    validationMessage={errors.odometerOverrideReason}
                    hint="For example: instrument cluster replaced. The reason is kept with the RO."
                  >
                    <Input
                      id="odometer-override-reason"
                      value={odometerReason}
                      onChange={(_, data) => {
                        setOdometerReason(data.value);
                        clear('odometerOverrideReason');
                      }}
                    />
                  </Field>
                  <Button onClick={saveWithReasons} disabled={create.isPending}>
                    Save anyway
                  </Button>
                </div>
              )}
            </div>
          </Card>
        </div>

        <Card className={styles.card}>
          <Subtitle2 as="h2">Concern and promise</Subtitle2>
          <Field
            label="What the customer asked for"
            required
            validationMessage={errors.concern}
            hint="In the customer's words: noises, warning lights, when it happens"
          >
            <Textarea
              value={draft.concern}
              rows={5}
              resize="vertical"
              onChange={(_, data) => {
                setDraft((d) => ({ ...d, concern: data.value }));
                clear('concern');
              }}
            />
          </Field>
          <Field
            label={`Promised for (shop time, ${zoneName})`}
            validationMessage={errors.promised ?? (promisedPassed ? PROMISE_PASSED : undefined)}
            validationState={errors.promised || promisedPassed ? 'error' : 'none'}
            hint="Leave empty when no time was promised"
          >
            <div className={styles.promised}>
              <Input
                type="date"
                id={promisedDateId}
                aria-labelledby={promisedDateId}
                aria-label="Promised date"
                value={draft.promisedDate}
                onChange={(_, data) => {
                  setDraft((d) => ({ ...d, promisedDate: data.value }));
                  clear('promised');
                }}
              />
              <Input
                type="time"
                id={promisedTimeId}
                aria-labelledby={promisedTimeId}
                aria-label="Promised time"
                value={draft.promisedTime}
                onChange={(_, data) => {
                  setDraft((d) => ({ ...d, promisedTime: data.value }));
                  clear('promised');
                }}
              />
            </div>
          </Field>
          {choices.length > 0 && (
            <div className={styles.choices}>
              {choices.map((choice) => (
                <Button
                  key={choice.label}
                  size="small"
                  onClick={() => {
                    setDraft((d) => ({ ...d, promisedDate: choice.date, promisedTime: choice.time }));
                    clear('promised');
                  }}
                >
                  {choice.label}
                </Button>
              ))}
              {(draft.promisedDate || draft.promisedTime) && (
                <Button
                  size="small"
                  appearance="subtle"
                  onClick={() => setDraft((d) => ({ ...d, promisedDate: '', promisedTime: '' }))}
                >
                  No promise
                </Button>
              )}
            </div>
          )}
        </Card>
      </div>

      <Card className={styles.card}>
        <div className={styles.linesHead}>
          <Subtitle2 as="h2">Job lines</Subtitle2>
          <Body1 className={styles.total} aria-live="polite">
            {draft.lines.length} {draft.lines.length === 1 ? 'line' : 'lines'} ·{' '}
            <strong>{Number(total.toFixed(1))} h</strong> book
          </Body1>
        </div>
        {menu.length === 0 && operations.isSuccess && (
          <Caption1 className={styles.dim}>The shop has no operations menu yet: type each job.</Caption1>
        )}
        {draft.lines.map((line, index) => (
          <div key={line.key} className={styles.line} role="group" aria-label={`Line ${index + 1}`}>
            <Body1 className={styles.lineNo}>{atStart(lineWords(index + 1))}</Body1>
            <Field label={rowLabel(index, 'Job', 'job')} validationMessage={errors[`lines.${index}.title`]}>
              <OperationPicker
                value={line.title}
                operations={menu}
                autoFocus={line.key === newLineKey}
                onTitle={(title) => setLine(index, (l) => ({ ...l, title }), 'title')}
                onPick={(operation) =>
                  setLine(index, (l) => lineFromOperation(l, operation), 'title', 'bookHours', 'skillLevel')
                }
              />
            </Field>
            <Field
              label={rowLabel(index, 'Book hours', 'book hours')}
              validationMessage={errors[`lines.${index}.bookHours`]}
            >
              <Input
                value={line.bookHours}
                inputMode="decimal"
                onChange={(_, data) => setLine(index, (l) => ({ ...l, bookHours: data.value }), 'bookHours')}
              />
            </Field>
            <Field
              label={rowLabel(index, 'Skill level', 'skill level')}
              validationMessage={errors[`lines.${index}.skillLevel`]}
            >
              <Select
                value={line.skillLevel}
                onChange={(_, data) =>
                  setLine(index, (l) => ({ ...l, skillLevel: data.value }), 'skillLevel')
                }
              >
                <option value="">Any</option>
                {[1, 2, 3, 4, 5].map((level) => (
                  <option key={level} value={level}>
                    {skillWords(level)}
                  </option>
                ))}
              </Select>
            </Field>
            <Button
              className={styles.remove}
              style={index === 0 ? { marginTop: '26px' } : undefined}
              appearance="subtle"
              disabled={draft.lines.length === 1}
              aria-label={`Remove line ${index + 1}`}
              onClick={() => removeLine(index)}
            >
              Remove
            </Button>
          </div>
        ))}
        {errors.lines && (
          <MessageBar intent="error">
            <MessageBarBody>{errors.lines}</MessageBarBody>
          </MessageBar>
        )}
        <div>
          <Button onClick={addLine} disabled={draft.lines.length >= 30}>
            Add a line
          </Button>
        </div>
      </Card>

      {errorCount > 0 && !odometerRefused && !vinRefused && (
        <MessageBar intent="error">
          <MessageBarBody>
            <MessageBarTitle>Not written yet</MessageBarTitle>
            {errorCount === 1 ? 'One field needs' : `${errorCount} fields need`} attention: see the marked
            fields.
          </MessageBarBody>
        </MessageBar>
      )}
      {vinRefused && (
        <MessageBar intent="warning">
          <MessageBarBody>
            <MessageBarTitle>
              The VIN does not pass the check for 1981-on North American vehicles
            </MessageBarTitle>
            Correct the VIN, or say why it is right and press Save with this VIN.
          </MessageBarBody>
        </MessageBar>
      )}
      {odometerRefused && (
        <MessageBar intent="warning">
          <MessageBarBody>
            <MessageBarTitle>The odometer reads lower than at the last visit</MessageBarTitle>
            Correct the reading, or give a reason and press Save anyway.
          </MessageBarBody>
        </MessageBar>
      )}
      <FormErrorBar message={formError} />
      <div className={styles.actions}>
        <Button appearance="primary" type="submit" disabled={create.isPending}>
          {create.isPending ? 'Writing…' : 'Write repair order'}
        </Button>
        <Button
          onClick={() => {
            forgetIntakeDraft(tabStorage());
            void navigate(paths.repairOrders);
          }}
        >
          Cancel
        </Button>
      </div>
    </form>
  );
}
