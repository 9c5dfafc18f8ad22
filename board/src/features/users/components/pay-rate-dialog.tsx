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
  Subtitle2,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import {
  PAY_TYPE_WORDS,
  firstWorkweekFrom,
  workweekDays,
  workweekName,
  type DatedPayRate,
  type UserDto,
  type WorkweekSettings,
} from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { FormErrorBar } from '@/components/form-error-bar';
import { formErrorText, formatMoney, type FieldErrors } from '@/lib/form-errors';
import { useUpdateUser } from '../api/update-user';
import { PAY_FIELD_OF, PayFields, payBody, payDraftOf, type PayDraft } from './pay-fields';

const useStyles = makeStyles({
  surface: { maxWidth: '40rem' },
  content: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  grid: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(14rem, 1fr))',
    gap: `${tokens.spacingVerticalM} ${tokens.spacingHorizontalL}`,
  },
  history: { margin: 0, paddingLeft: tokens.spacingHorizontalL },
  dim: { color: tokens.colorNeutralForeground3 },
});

/**
 * "From 2026-10-18", or for a date inside a workweek, the week it first applies to: "From 2026-10-14, so from
 * the Week of Sun, Oct 18".
 */
export function rateStartWords(effectiveFrom: string, shop: WorkweekSettings): string {
  const first = firstWorkweekFrom(effectiveFrom, shop);
  return workweekDays(first, shop)[0]!.day === effectiveFrom
    ? `From ${effectiveFrom}`
    : `From ${effectiveFrom}, so from the ${workweekName(first, shop, true)}`;
}

/** "Flat rate: $32.00 a flagged hour, $18.00 other time". */
export function rateWords(rate: Omit<DatedPayRate, 'effectiveFrom' | 'recordedAt'>): string {
  const hourly = formatMoney(rate.hourlyRateCents);
  const body =
    rate.payType === 'hourly'
      ? `${hourly} an hour`
      : rate.payType === 'flat-rate-guarantee'
        ? `${formatMoney(rate.flatRateCents)} a flagged hour, guarantee ${formatMoney(rate.guaranteeCents)}, waiting ${hourly}`
        : `${formatMoney(rate.flatRateCents)} a flagged hour, ${hourly} other time`;
  return `${PAY_TYPE_WORDS[rate.payType]}: ${body}${rate.overtimeExempt ? ' · exempt from overtime' : ''}`;
}

/**
 * A new rate from a date: past weeks keep theirs, and a closed pay week never changes. Driven by `open` and
 * kept mounted while it closes (see the correction dialog).
 */
export function PayRateDialog({
  open,
  user,
  shop,
  onClose,
}: {
  open: boolean;
  user: UserDto;
  /** Where the shop's workweeks fall: a rate covers whole ones. */
  shop: WorkweekSettings;
  onClose: () => void;
}) {
  const styles = useStyles();
  const update = useUpdateUser();
  const [draft, setDraft] = useState<PayDraft>(() => payDraftOf(user));
  const [effectiveFrom, setEffectiveFrom] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const { body, errors: local } = payBody(draft);
    if (Object.keys(local).length) return setErrors(local);
    update.mutate(
      { id: user.id, ...body, ...(effectiveFrom ? { effectiveFrom } : {}) },
      {
        onSuccess: onClose,
        onError: (error) => {
          if (error instanceof ApiError && Object.keys(error.fieldErrors).length) {
            const server: FieldErrors = {};
            for (const [key, message] of Object.entries(error.fieldErrors))
              server[PAY_FIELD_OF[key] ?? key] = message;
            setErrors(server);
          }
          setFormError(formErrorText(error));
        },
      },
    );
  };

  return (
    <Dialog open={open} onOpenChange={(_, data) => !data.open && onClose()} modalType="modal">
      <DialogSurface className={styles.surface}>
        <form onSubmit={submit} noValidate>
          <DialogBody>
            <DialogTitle>Pay for {user.name}</DialogTitle>
            <DialogContent className={styles.content}>
              <div className={styles.grid}>
                <PayFields
                  draft={draft}
                  errors={errors}
                  onChange={(key, value) => {
                    setDraft((current) => ({ ...current, [key]: value }));
                    setErrors((current) => ({ ...current, [key]: undefined }));
                  }}
                />
                <Field
                  label="Takes effect from"
                  validationMessage={errors.effectiveFrom}
                  hint="Blank: from the start of this workweek. A rate applies to every workweek that begins on or after its date; weeks before keep theirs, and a closed pay week never changes."
                >
                  <Input
                    type="date"
                    value={effectiveFrom}
                    onChange={(_, data) => setEffectiveFrom(data.value)}
                  />
                </Field>
                {effectiveFrom && (
                  <Caption1 className={styles.dim} role="status">
                    Applies from the {workweekName(firstWorkweekFrom(effectiveFrom, shop), shop, true)}.
                  </Caption1>
                )}
              </div>
              <Subtitle2 as="h3">Rates on record</Subtitle2>
              <ul className={styles.history}>
                {user.payRates.map((rate) => (
                  <li key={rate.effectiveFrom}>
                    {rateStartWords(rate.effectiveFrom, shop)}: {rateWords(rate)}
                  </li>
                ))}
              </ul>
              <Caption1 className={styles.dim}>Each rate applies from its date until the next one.</Caption1>
              <FormErrorBar message={formError} />
            </DialogContent>
            <DialogActions>
              <Button type="button" onClick={onClose}>
                Cancel
              </Button>
              <Button appearance="primary" type="submit" disabled={update.isPending}>
                {update.isPending ? 'Saving…' : 'Save the new rate'}
              </Button>
            </DialogActions>
          </DialogBody>
        </form>
      </DialogSurface>
    </Dialog>
  );
}
