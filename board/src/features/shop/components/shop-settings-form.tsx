import { useMemo, useState, type FormEvent } from 'react';
import {
  Button,
  Card,
  Field,
  Input,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Select,
  Spinner,
  Subtitle2,
  Switch,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import {
  formatPhone,
  PAY_RULE_FIELDS,
  shopSettingsSchema,
  type ShopSettings,
  type UpdateShopBody,
} from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import {
  centsToDollars,
  dollarsToCents,
  formErrorText,
  formatMoney,
  issuesToFieldErrors,
  type FieldErrors,
} from '@/lib/form-errors';
import { usePayRules } from '../api/get-pay-rules';
import { useShop } from '../api/get-shop';
import { useUpdateShop } from '../api/update-shop';

const DAYS = ['Sunday', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday'];

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXL, maxWidth: '60rem' },
  card: { padding: tokens.spacingHorizontalXL, gap: tokens.spacingVerticalM },
  grid: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(15rem, 1fr))',
    gap: `${tokens.spacingVerticalM} ${tokens.spacingHorizontalL}`,
    alignItems: 'start',
  },
  hours: {
    display: 'grid',
    gridTemplateColumns: '8rem 9rem minmax(7rem, 10rem) minmax(7rem, 10rem)',
    gap: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalM}`,
    alignItems: 'center',
    '@media (max-width: 700px)': { gridTemplateColumns: '1fr 1fr' },
  },
  actions: { display: 'flex', gap: tokens.spacingHorizontalM, alignItems: 'center' },
  history: { margin: 0, paddingLeft: tokens.spacingHorizontalL, color: tokens.colorNeutralForeground2 },
});

const RULE_NAMES = { federal: 'US federal overtime', california: 'California overtime' } as const;

/** The pay rules on record: each applies to the weeks that begin from its date until the next. */
function PayRulesHistory() {
  const styles = useStyles();
  const rules = usePayRules();
  if (!rules.data) return null;
  return (
    <ul className={styles.history} aria-label="Pay rules on record">
      {[...rules.data].reverse().map((rule) => (
        <li key={rule.effectiveFrom}>
          From {rule.effectiveFrom}: {RULE_NAMES[rule.overtimeRules]}, state minimum wage{' '}
          {formatMoney(rule.minimumWageCents)}
          {rule.localMinimumWageCents !== null && `, local ${formatMoney(rule.localMinimumWageCents)}`}, other
          time {rule.payNonProductiveSeparately ? 'paid separately' : 'covered by flat-rate pay'}
        </li>
      ))}
    </ul>
  );
}

function timeZones(current: string): string[] {
  const intl = Intl as typeof Intl & { supportedValuesOf?: (key: 'timeZone') => string[] };
  const zones = intl.supportedValuesOf?.('timeZone') ?? [];
  return zones.includes(current) ? zones : [current, ...zones];
}

interface Draft extends Omit<
  ShopSettings,
  'minimumWageCents' | 'localMinimumWageCents' | 'labourRateCents' | 'phone'
> {
  minimumWage: string;
  /** Blank: no local minimum wage. */
  localMinimumWage: string;
  /** Blank: a change of pay rules counts from the start of this workweek. */
  payRulesFrom: string;
  labourRate: string;
  phone: string;
}

function toDraft(shop: ShopSettings): Draft {
  const { minimumWageCents, localMinimumWageCents, labourRateCents, phone, ...rest } = shop;
  return {
    ...rest,
    minimumWage: centsToDollars(minimumWageCents),
    localMinimumWage: localMinimumWageCents === null ? '' : centsToDollars(localMinimumWageCents),
    payRulesFrom: '',
    labourRate: centsToDollars(labourRateCents),
    phone: phone ? formatPhone(phone) : '',
  };
}

/** Only the fields that changed go to the server. */
function changes(before: ShopSettings, after: ShopSettings): UpdateShopBody {
  const patch: Record<string, unknown> = {};
  for (const key of Object.keys(after) as (keyof ShopSettings)[])
    if (JSON.stringify(before[key]) !== JSON.stringify(after[key])) patch[key] = after[key];
  return patch as UpdateShopBody;
}

function ShopForm({
  shop,
  justSaved,
  onSaved,
}: {
  shop: ShopSettings;
  justSaved: boolean;
  onSaved: (saved: ShopSettings) => void;
}) {
  const styles = useStyles();
  const update = useUpdateShop();
  const [draft, setDraft] = useState<Draft>(() => toDraft(shop));
  const [errors, setErrors] = useState<FieldErrors>({});
  const [saved, setSaved] = useState(justSaved);
  const zones = useMemo(() => timeZones(shop.timeZone), [shop.timeZone]);

  const set = <K extends keyof Draft>(key: K, value: Draft[K]) => {
    setDraft((current) => ({ ...current, [key]: value }));
    setSaved(false);
  };

  const setDay = (day: number, value: ShopSettings['openingHours'][number]) => {
    setDraft((current) => ({
      ...current,
      openingHours: current.openingHours.map((d, i) => (i === day ? value : d)),
    }));
    setSaved(false);
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setSaved(false);
    const { minimumWage, localMinimumWage, payRulesFrom, labourRate, ...rest } = draft;
    const cents = dollarsToCents(minimumWage);
    const localCents = localMinimumWage.trim() ? dollarsToCents(localMinimumWage) : null;
    const rateCents = dollarsToCents(labourRate);
    const parsed = shopSettingsSchema.safeParse({
      ...rest,
      minimumWageCents: cents ?? Number.NaN,
      localMinimumWageCents: localMinimumWage.trim() && localCents === null ? Number.NaN : localCents,
      labourRateCents: rateCents ?? Number.NaN,
    });
    if (!parsed.success) {
      const found = issuesToFieldErrors(parsed.error.issues);
      if (found.minimumWageCents)
        found.minimumWage = cents === null ? 'Type an amount in dollars, like 7.25' : found.minimumWageCents;
      if (found.localMinimumWageCents)
        found.localMinimumWage =
          localCents === null ? 'Type an amount in dollars, or leave it blank' : found.localMinimumWageCents;
      if (found.labourRateCents)
        found.labourRate = rateCents === null ? 'Type an amount in dollars, like 135' : found.labourRateCents;
      setErrors(found);
      return;
    }
    setErrors({});
    const patch = changes(shop, parsed.data);
    if (Object.keys(patch).length === 0) return setSaved(true);
    if (payRulesFrom && PAY_RULE_FIELDS.some((field) => field in patch)) patch.payRulesFrom = payRulesFrom;
    update.mutate(patch, {
      onSuccess: (updated) => {
        setSaved(true);
        onSaved(updated);
      },
      onError: (error) => {
        if (error instanceof ApiError && Object.keys(error.fieldErrors).length) {
          const server: FieldErrors = { ...error.fieldErrors };
          server.minimumWage ??= server.minimumWageCents;
          server.localMinimumWage ??= server.localMinimumWageCents;
          server.labourRate ??= server.labourRateCents;
          setErrors(server);
        }
      },
    });
  };

  type NumberSetting =
    | 'workweekStartDay'
    | 'workweekStartHour'
    | 'maxConcurrentJobs'
    | 'kioskIdleSeconds'
    | 'minimumMealMinutes'
    | 'longShiftHours'
    | 'minimumClockedMinutesForDone'
    | 'minimumClockedHoursForEfficiency'
    | 'approvalLinkHours';
  const number = (key: NumberSetting) => (_: unknown, data: { value: string }) =>
    set(key, Number(data.value));
  const numberField = (key: NumberSetting, label: string, [min, max]: [number, number], hint?: string) => (
    <Field label={label} validationMessage={errors[key]} hint={hint}>
      <Input type="number" min={min} max={max} value={String(draft[key])} onChange={number(key)} />
    </Field>
  );

  return (
    <form className={styles.form} onSubmit={submit} noValidate>
      <Card className={styles.card}>
        <Subtitle2 as="h2">Shop</Subtitle2>
        <div className={styles.grid}>
          <Field label="Shop name" required validationMessage={errors.name}>
            <Input value={draft.name} maxLength={80} onChange={(_, data) => set('name', data.value)} />
          </Field>
          <Field
            label="Time zone"
            required
            validationMessage={errors.timeZone}
            hint="Also sets when each pay week starts, so it cannot change while that would move a closed pay week"
          >
            {zones.length > 1 ? (
              <Select value={draft.timeZone} onChange={(_, data) => set('timeZone', data.value)}>
                {zones.map((zone) => (
                  <option key={zone}>{zone}</option>
                ))}
              </Select>
            ) : (
              <Input value={draft.timeZone} onChange={(_, data) => set('timeZone', data.value)} />
            )}
          </Field>
          <Field label="Units" validationMessage={errors.units}>
            <Select value={draft.units} onChange={(_, data) => set('units', data.value as Draft['units'])}>
              <option value="us">US (°F, qt, lbf·ft)</option>
              <option value="metric">Metric (°C, L, N·m)</option>
            </Select>
          </Field>
          <Field label="Clock times" validationMessage={errors.clockFormat}>
            <Select
              value={draft.clockFormat}
              onChange={(_, data) => set('clockFormat', data.value as Draft['clockFormat'])}
            >
              <option value="12h">12-hour (2:30 pm)</option>
              <option value="24h">24-hour (14:30)</option>
            </Select>
          </Field>
          {numberField(
            'kioskIdleSeconds',
            'Kiosk signs out after (seconds)',
            [15, 600],
            '15 to 600 seconds without a tap',
          )}
          <Field label="Unassigned lines" validationMessage={errors.techniciansTakeUnassigned}>
            <Switch
              checked={draft.techniciansTakeUnassigned}
              onChange={(_, data) => set('techniciansTakeUnassigned', data.checked)}
              label={
                draft.techniciansTakeUnassigned
                  ? 'Technicians may clock onto them and take them'
                  : 'Only the foreman assigns them'
              }
            />
          </Field>
        </div>
      </Card>

      <Card className={styles.card}>
        <Subtitle2 as="h2">Customers and approvals</Subtitle2>
        <div className={styles.grid}>
          <Field
            label="Shop phone"
            validationMessage={errors.phone}
            hint="Shown to customers on the approval page"
          >
            <Input
              type="tel"
              value={draft.phone}
              maxLength={30}
              onChange={(_, data) => set('phone', data.value)}
            />
          </Field>
          <Field
            label="Labour rate ($ per hour)"
            required
            validationMessage={errors.labourRate}
            hint="Prices findings: book hours × this rate, plus parts"
          >
            <Input
              inputMode="decimal"
              value={draft.labourRate}
              onChange={(_, data) => set('labourRate', data.value)}
            />
          </Field>
          <Field
            label="Tax note"
            validationMessage={errors.taxNote}
            hint="Shown under prices, e.g. Sales tax is added on the final invoice."
          >
            <Input value={draft.taxNote} maxLength={200} onChange={(_, data) => set('taxNote', data.value)} />
          </Field>
          {numberField(
            'approvalLinkHours',
            'Approval links work for (hours)',
            [1, 720],
            '1 to 720 hours; 72 is three days',
          )}
        </div>
      </Card>

      <Card className={styles.card}>
        <Subtitle2 as="h2">Opening hours</Subtitle2>
        <div className={styles.hours} role="group" aria-label="Opening hours">
          {draft.openingHours.map((day, index) => (
            <OpeningDay
              key={DAYS[index]}
              day={DAYS[index] ?? ''}
              value={day}
              error={errors[`openingHours.${index}.open`] ?? errors[`openingHours.${index}.close`]}
              onChange={(value) => setDay(index, value)}
            />
          ))}
        </div>
      </Card>

      <Card className={styles.card}>
        <Subtitle2 as="h2">Time and forecasts</Subtitle2>
        <div className={styles.grid}>
          <Field
            label="Workweek starts on"
            validationMessage={errors.workweekStartDay}
            hint="Pay weeks start on this day and hour. A change that would move a closed pay week is refused. 29 CFR 778.105 allows a change meant to last, not one to avoid overtime: agree it with payroll first."
          >
            <Select value={String(draft.workweekStartDay)} onChange={number('workweekStartDay')}>
              {DAYS.map((day, index) => (
                <option key={day} value={index}>
                  {day}
                </option>
              ))}
            </Select>
          </Field>
          <Field label="at" validationMessage={errors.workweekStartHour}>
            <Select value={String(draft.workweekStartHour)} onChange={number('workweekStartHour')}>
              {Array.from({ length: 24 }, (_, hour) => (
                <option key={hour} value={hour}>
                  {String(hour).padStart(2, '0')}:00
                </option>
              ))}
            </Select>
          </Field>
          <Field
            label="Jobs a technician may be clocked on at once"
            validationMessage={errors.maxConcurrentJobs}
            hint="Clocking onto one more closes the oldest. A change applies from now on: time already clocked stays as it was, and a punch added later for an earlier moment follows the limit of that moment."
          >
            <Select value={String(draft.maxConcurrentJobs)} onChange={number('maxConcurrentJobs')}>
              {[1, 2, 3, 4].map((n) => (
                <option key={n} value={n}>
                  {n}
                </option>
              ))}
            </Select>
          </Field>
          <Field
            label="Time on several jobs at once"
            validationMessage={errors.concurrentSplit}
            hint="A change applies from now on: time already clocked stays as it was counted."
          >
            <Select
              value={draft.concurrentSplit}
              onChange={(_, data) => set('concurrentSplit', data.value as Draft['concurrentSplit'])}
            >
              <option value="even">Split evenly between them</option>
              <option value="full">Full time to each</option>
            </Select>
          </Field>
          {numberField(
            'minimumClockedHoursForEfficiency',
            "Minimum clocked hours before a technician's own efficiency drives forecasts",
            [0, 200],
            "In the last four weeks; below it, forecasts use the shop's figure",
          )}
        </div>
      </Card>

      <Card className={styles.card}>
        <Subtitle2 as="h2">Timecard checks</Subtitle2>
        <div className={styles.grid}>
          {numberField(
            'minimumMealMinutes',
            'Shortest unpaid meal (minutes)',
            [10, 60],
            'A “meal” shorter than this counts as a paid rest break. 29 CFR 785.19(a): 30 minutes or more is ordinarily long enough. A change applies to breaks from now on; breaks already taken stay as counted.',
          )}
          {numberField(
            'longShiftHours',
            'Shift open longer than (hours) goes on the exceptions list',
            [8, 24],
          )}
          {numberField(
            'minimumClockedMinutesForDone',
            "Done with less clocked time than this (minutes) needs a foreman's sign-off",
            [0, 120],
            "Until signed off, the line's book hours are not flagged",
          )}
        </div>
      </Card>

      <Card className={styles.card}>
        <Subtitle2 as="h2">Pay rules</Subtitle2>
        <PayRulesHistory />
        <div className={styles.grid}>
          <Field label="Overtime rules" validationMessage={errors.overtimeRules}>
            <Select
              value={draft.overtimeRules}
              onChange={(_, data) => set('overtimeRules', data.value as Draft['overtimeRules'])}
            >
              <option value="federal">US federal (over 40 hours a week)</option>
              <option value="california">California (daily and weekly)</option>
            </Select>
          </Field>
          <Field
            label="State minimum wage ($ per hour)"
            required
            validationMessage={errors.minimumWage}
            hint="The federal $7.25 where the state has none; California rules need California's figure"
          >
            <Input
              inputMode="decimal"
              value={draft.minimumWage}
              onChange={(_, data) => set('minimumWage', data.value)}
            />
          </Field>
          <Field
            label="Local minimum wage ($ per hour)"
            validationMessage={errors.localMinimumWage}
            hint="A city or county figure, if any; the highest of federal, state and local applies"
          >
            <Input
              inputMode="decimal"
              value={draft.localMinimumWage}
              onChange={(_, data) => set('localMinimumWage', data.value)}
            />
          </Field>
          <Field label="Non-productive time" validationMessage={errors.payNonProductiveSeparately}>
            <Switch
              checked={draft.payNonProductiveSeparately}
              onChange={(_, data) => set('payNonProductiveSeparately', data.checked)}
              label={
                draft.payNonProductiveSeparately
                  ? 'Paid separately at the hourly rate'
                  : 'Covered by flat-rate pay'
              }
            />
          </Field>
          <Field
            label="A change of these rules takes effect from"
            validationMessage={errors.payRulesFrom}
            hint="Blank: from the start of this workweek. Each week is paid with the rules in force when it began; a closed pay week never changes."
          >
            <Input
              type="date"
              value={draft.payRulesFrom}
              onChange={(_, data) => set('payRulesFrom', data.value)}
            />
          </Field>
        </div>
      </Card>

      <Card className={styles.card}>
        <Subtitle2 as="h2">Pay practice</Subtitle2>
        <div className={styles.grid}>
          <Field
            label="Lines clocked over several weeks"
            validationMessage={errors.apportionSpanningLines}
            hint="On: for overtime, a line's flat-rate pay is shared over the weeks it was clocked in, and the extra premium for an earlier week is paid in the week the line is finished. 29 CFR 778.119–778.120 prescribe this for commissions; for flat-rate pay it is an analogy: confirm with counsel."
          >
            <Switch
              checked={draft.apportionSpanningLines}
              onChange={(_, data) => set('apportionSpanningLines', data.checked)}
              label="Share flat-rate pay over those weeks for overtime"
            />
          </Field>
          <Field
            label="Kiosk"
            validationMessage={errors.kioskShowsPay}
            hint="My week always shows flagged and clocked hours and efficiency"
          >
            <Switch
              checked={draft.kioskShowsPay}
              onChange={(_, data) => set('kioskShowsPay', data.checked)}
              label="Show technicians their estimated earnings"
            />
          </Field>
        </div>
        <MessageBar intent="warning" layout="multiline">
          <MessageBarBody>
            <MessageBarTitle>Pay figures are estimates</MessageBarTitle>
            Confirm overtime, minimum wage and rest-break rules against the wage law that applies to your
            shop, your payroll provider and licensed advice.
          </MessageBarBody>
        </MessageBar>
      </Card>

      {update.isError &&
        !(update.error instanceof ApiError && Object.keys(update.error.fieldErrors).length) && (
          <MessageBar intent="error">
            <MessageBarBody>{formErrorText(update.error)}</MessageBarBody>
          </MessageBar>
        )}
      {Object.values(errors).some(Boolean) && (
        <MessageBar intent="error">
          <MessageBarBody>Some settings need a fix: see the fields marked in red.</MessageBarBody>
        </MessageBar>
      )}
      {saved && (
        <MessageBar intent="success">
          <MessageBarBody>Settings saved.</MessageBarBody>
        </MessageBar>
      )}
      <div className={styles.actions}>
        <Button appearance="primary" type="submit" disabled={update.isPending}>
          {update.isPending ? 'Saving…' : 'Save settings'}
        </Button>
        <Button
          disabled={update.isPending}
          onClick={() => {
            setDraft(toDraft(shop));
            setErrors({});
            setSaved(false);
          }}
        >
          Undo changes
        </Button>
      </div>
    </form>
  );
}

function OpeningDay({
  day,
  value,
  error,
  onChange,
}: {
  day: string;
  value: ShopSettings['openingHours'][number];
  error: string | undefined;
  onChange: (value: ShopSettings['openingHours'][number]) => void;
}) {
  return (
    <>
      <span>{day}</span>
      <Switch
        checked={value !== null}
        label={value ? 'Open' : 'Closed'}
        aria-label={`${day} open`}
        onChange={(_, data) => onChange(data.checked ? { open: '08:00', close: '17:00' } : null)}
      />
      {value ? (
        <>
          <Field validationMessage={error}>
            <Input
              type="time"
              aria-label={`${day} opens`}
              value={value.open}
              onChange={(_, data) => onChange({ ...value, open: data.value })}
            />
          </Field>
          <Field>
            <Input
              type="time"
              aria-label={`${day} closes`}
              value={value.close}
              onChange={(_, data) => onChange({ ...value, close: data.value })}
            />
          </Field>
        </>
      ) : (
        <>
          <span />
          <span />
        </>
      )}
    </>
  );
}

export function ShopSettingsForm() {
  const shop = useShop();
  const [savedAt, setSavedAt] = useState<string | null>(null);
  if (shop.isPending) return <Spinner label="Loading settings…" />;
  if (shop.isError)
    return (
      <MessageBar intent="error">
        <MessageBarBody>{formErrorText(shop.error)}</MessageBarBody>
      </MessageBar>
    );
  // A fresh form whenever the saved settings change, so the draft starts from the truth.
  const version = JSON.stringify(shop.data);
  return (
    <ShopForm
      key={version}
      shop={shop.data}
      justSaved={savedAt === version}
      onSaved={(saved) => setSavedAt(JSON.stringify(saved))}
    />
  );
}
