import { Field, Input, Select, Switch, makeStyles, tokens } from '@fluentui/react-components';
import {
  OVERTIME_EXEMPTION_CONDITION,
  PAY_TYPES,
  PAY_TYPE_WORDS,
  type PayRate,
  type PayType,
} from '@baytime/shared';
import { centsToDollars, dollarsToCents, type FieldErrors } from '@/lib/form-errors';

export interface PayDraft {
  payType: PayType;
  flatRate: string;
  hourlyRate: string;
  guarantee: string;
  /** On: the person is paid overtime (not exempt). */
  paidOvertime: boolean;
}

export const EMPTY_PAY: PayDraft = {
  payType: 'flat-rate',
  flatRate: '',
  hourlyRate: '',
  guarantee: '',
  paidOvertime: true,
};

/** Form fields that hold a body field under another name (dollars typed, cents sent). */
export const PAY_FIELD_OF: Record<string, keyof PayDraft> = {
  flatRateCents: 'flatRate',
  hourlyRateCents: 'hourlyRate',
  guaranteeCents: 'guarantee',
  overtimeExempt: 'paidOvertime',
};

export function payDraftOf(rate: PayRate): PayDraft {
  return {
    payType: rate.payType,
    flatRate: centsToDollars(rate.flatRateCents),
    hourlyRate: centsToDollars(rate.hourlyRateCents),
    guarantee: centsToDollars(rate.guaranteeCents),
    paidOvertime: !rate.overtimeExempt,
  };
}

/** The rate a pay type is paid by, when left blank or at nothing: such a week would pay $0 for the work. */
export function missingRates(draft: PayDraft): FieldErrors {
  // Blank or $0; an amount that is not one is told as such by its own check.
  const nothing = (text: string) => text.trim() === '' || dollarsToCents(text) === 0;
  if (draft.payType === 'hourly')
    return nothing(draft.hourlyRate) ? { hourlyRate: 'Give the hourly rate' } : {};
  return nothing(draft.flatRate) ? { flatRate: 'Give the flat rate per flagged hour' } : {};
}

/** The rates typed in dollars as a body in cents; a blank amount is left out. */
export function payBody(draft: PayDraft): { body: Partial<PayRate>; errors: FieldErrors } {
  const errors: FieldErrors = { ...missingRates(draft) };
  const body: Partial<PayRate> = { payType: draft.payType, overtimeExempt: !draft.paidOvertime };
  for (const [field, key] of [
    ['flatRate', 'flatRateCents'],
    ['hourlyRate', 'hourlyRateCents'],
    ['guarantee', 'guaranteeCents'],
  ] as const) {
    if (!draft[field].trim()) continue;
    const cents = dollarsToCents(draft[field]);
    if (cents === null) errors[field] = 'Type an amount in dollars, like 28.50';
    else body[key] = cents;
  }
  if (draft.payType === 'flat-rate-guarantee' && !body.guaranteeCents)
    errors.guarantee = 'Give the hourly guarantee for productive time';
  return { body, errors };
}

const useStyles = makeStyles({
  wide: { gridColumn: '1 / -1' },
  condition: { color: tokens.colorNeutralForeground2 },
});

/** Pay type, rates and the overtime exemption, with what each one means. */
export function PayFields({
  draft,
  errors,
  onChange,
}: {
  draft: PayDraft;
  errors: FieldErrors;
  onChange: <K extends keyof PayDraft>(key: K, value: PayDraft[K]) => void;
}) {
  const styles = useStyles();
  const hourly = draft.payType === 'hourly';
  return (
    <>
      <Field label="Pay type" validationMessage={errors.payType}>
        <Select value={draft.payType} onChange={(_, data) => onChange('payType', data.value as PayType)}>
          {PAY_TYPES.map((type) => (
            <option key={type} value={type}>
              {PAY_TYPE_WORDS[type]}
            </option>
          ))}
        </Select>
      </Field>
      {!hourly && (
        <Field label="Flat rate per flagged hour ($)" validationMessage={errors.flatRate}>
          <Input
            value={draft.flatRate}
            inputMode="decimal"
            onChange={(_, data) => onChange('flatRate', data.value)}
          />
        </Field>
      )}
      {draft.payType === 'flat-rate-guarantee' && (
        <Field
          label="Hourly guarantee for productive time ($)"
          validationMessage={errors.guarantee}
          hint="29 CFR 778.111(b): the week pays the larger of the flat-rate pay and this × hours on jobs."
        >
          <Input
            value={draft.guarantee}
            inputMode="decimal"
            onChange={(_, data) => onChange('guarantee', data.value)}
          />
        </Field>
      )}
      <Field
        label={hourly ? 'Hourly rate ($)' : 'Hourly rate for waiting and other time ($)'}
        validationMessage={errors.hourlyRate}
      >
        <Input
          value={draft.hourlyRate}
          inputMode="decimal"
          onChange={(_, data) => onChange('hourlyRate', data.value)}
        />
      </Field>
      <Field
        className={styles.wide}
        label="Overtime"
        hint={
          <span className={styles.condition}>
            Off only for a person exempt from overtime: {OVERTIME_EXEMPTION_CONDITION}
          </span>
        }
      >
        <Switch
          checked={draft.paidOvertime}
          onChange={(_, data) => onChange('paidOvertime', data.checked)}
          label="Paid overtime"
        />
      </Field>
    </>
  );
}
