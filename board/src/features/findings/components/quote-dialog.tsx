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
  Text,
  Textarea,
  makeStyles,
  shorthands,
  tokens,
} from '@fluentui/react-components';
import { findingPrice, findingQuoteSchema, formatCents, type FindingDto } from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import {
  centsToDollars,
  dollarsToCents,
  formErrorText,
  issuesToFieldErrors,
  type FieldErrors,
} from '@/lib/form-errors';
import { useSaveQuote } from '../api/save-quote';
import { parseHours } from '../findings-model';

const useStyles = makeStyles({
  surface: { maxWidth: '38rem' },
  content: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  note: {
    margin: 0,
    padding: `${tokens.spacingVerticalXS} ${tokens.spacingHorizontalM}`,
    ...shorthands.borderLeft(tokens.strokeWidthThicker, 'solid', tokens.colorNeutralStroke1),
    color: tokens.colorNeutralForeground2,
    whiteSpace: 'pre-wrap',
  },
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalL },
  small: { maxWidth: '10rem' },
  price: { fontVariantNumeric: 'tabular-nums' },
});

/**
 * The advisor's review before anything reaches the customer: the words they will read (the
 * technician's note stays in the shop), the book hours and the parts, priced at the shop's rate.
 */
export function QuoteDialog({
  finding,
  labourRateCents,
  onClose,
}: {
  finding: FindingDto;
  labourRateCents: number | undefined;
  onClose: () => void;
}) {
  const styles = useStyles();
  const save = useSaveQuote();
  const [wording, setWording] = useState(finding.customerWording ?? '');
  const [hours, setHours] = useState(String(finding.bookHours ?? finding.suggestedHours ?? ''));
  const [parts, setParts] = useState(finding.partsCents === null ? '' : centsToDollars(finding.partsCents));
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  const bookHours = parseHours(hours);
  const partsCents = parts.trim() ? dollarsToCents(parts) : null;
  const price =
    bookHours !== null && labourRateCents && (partsCents !== null || !parts.trim())
      ? findingPrice(bookHours, labourRateCents, partsCents)
      : null;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    const parsed = findingQuoteSchema.safeParse({
      customerWording: wording,
      bookHours: bookHours ?? undefined,
      partsCents: parts.trim() ? (partsCents ?? Number.NaN) : null,
    });
    if (!parsed.success) {
      const found = issuesToFieldErrors(parsed.error.issues);
      if (hours.trim() && bookHours === null) found.bookHours = 'Type the hours as a number, like 1.5';
      if (parts.trim() && partsCents === null) found.partsCents = 'Type an amount in dollars, like 42.80';
      return setErrors(found);
    }
    save.mutate(
      { id: finding.id, body: parsed.data },
      {
        onSuccess: onClose,
        onError: (error) => {
          if (error instanceof ApiError && Object.keys(error.fieldErrors).length)
            return setErrors(error.fieldErrors as FieldErrors);
          setFormError(formErrorText(error));
        },
      },
    );
  };

  return (
    <Dialog open onOpenChange={(_, data) => !data.open && onClose()}>
      <DialogSurface className={styles.surface}>
        <form onSubmit={submit} noValidate>
          <DialogBody>
            <DialogTitle>For the customer</DialogTitle>
            <DialogContent className={styles.content}>
              <Text>The technician wrote (the customer does not see this):</Text>
              <blockquote className={styles.note}>{finding.note}</blockquote>
              <Field
                label="What the customer reads"
                required
                validationMessage={errors.customerWording}
                hint="Plain words: what is wrong, why it matters, what the work is."
              >
                <Textarea
                  value={wording}
                  maxLength={1000}
                  resize="vertical"
                  autoFocus
                  onChange={(_, data) => {
                    setWording(data.value);
                    setErrors((current) => ({ ...current, customerWording: undefined }));
                  }}
                />
              </Field>
              <div className={styles.row}>
                <Field
                  label="Book hours"
                  required
                  validationMessage={errors.bookHours}
                  hint={finding.suggestedHours === null ? undefined : `Suggested ${finding.suggestedHours} h`}
                >
                  <Input
                    className={styles.small}
                    value={hours}
                    inputMode="decimal"
                    onChange={(_, data) => {
                      setHours(data.value);
                      setErrors((current) => ({ ...current, bookHours: undefined }));
                    }}
                  />
                </Field>
                <Field label="Parts ($)" validationMessage={errors.partsCents} hint="Optional">
                  <Input
                    className={styles.small}
                    value={parts}
                    inputMode="decimal"
                    onChange={(_, data) => {
                      setParts(data.value);
                      setErrors((current) => ({ ...current, partsCents: undefined }));
                    }}
                  />
                </Field>
              </div>
              <Text className={styles.price} role="status">
                {!labourRateCents
                  ? 'Set the shop’s labour rate under Admin, Shop settings to price this.'
                  : price
                    ? `${bookHours} h × ${formatCents(labourRateCents)} = ${formatCents(price.labourCents)}` +
                      (price.partsCents
                        ? ` + parts ${formatCents(price.partsCents)} = ${formatCents(price.priceCents)}`
                        : '') +
                      ' (estimate)'
                    : 'The price shows once the hours are a number.'}
              </Text>
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
              <Button appearance="primary" type="submit" disabled={save.isPending}>
                {save.isPending ? 'Saving…' : 'Save for the customer'}
              </Button>
            </DialogActions>
          </DialogBody>
        </form>
      </DialogSurface>
    </Dialog>
  );
}
