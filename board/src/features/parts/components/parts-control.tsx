import { useState } from 'react';
import { z } from 'zod';
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
  Select,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import {
  PARTS_STATES,
  PARTS_STATE_WORDS,
  partsDetailsSchema,
  shopLocalInstant,
  type HoldReason,
  type JobLineStatus,
  type PartsHoldDto,
} from '@baytime/shared';
import { Glyph } from '@/components/glyph';
import { formErrorText } from '@/lib/form-errors';
import { checkedAsBody, showServerErrors, useSchemaForm } from '@/lib/form';
import { useReceiveParts } from '../api/receive-parts';
import { useRecordParts } from '../api/record-parts';
import { arrivalInputs, partsSummary } from '../parts-format';

const useStyles = makeStyles({
  row: { display: 'flex', alignItems: 'center', flexWrap: 'wrap', gap: `2px ${tokens.spacingHorizontalS}` },
  glyph: { width: '15px', height: '15px', flexShrink: 0 },
  late: { color: tokens.colorPaletteRedForeground1, fontWeight: tokens.fontWeightSemibold },
  surface: { maxWidth: '38rem' },
  content: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  when: { display: 'grid', gridTemplateColumns: '1fr 9rem', gap: tokens.spacingHorizontalM },
});

export interface PartsLine {
  id: number;
  status: JobLineStatus;
  holdReason: HoldReason | null;
  parts: PartsHoldDto | null;
}

export interface PartsControlProps {
  line: PartsLine;
  /** "RO 4417 line 2: Replace tie rod end", for the dialog and the button's name. */
  label: string;
  timeZone: string | undefined;
  nowMs: number;
  canEdit: boolean;
}

/** On a line held for parts: what it waits for, and (office) a dialog to record it and mark it in. */
export function PartsControl({ line, label, timeZone, nowMs, canEdit }: PartsControlProps) {
  const styles = useStyles();
  const [open, setOpen] = useState(false);
  if (line.status !== 'held' || line.holdReason !== 'parts') return null;
  const late = line.parts?.expectedAt ? Date.parse(line.parts.expectedAt) <= nowMs : false;
  const empty: PartsHoldDto = { part: null, state: null, supplier: null, expectedAt: null, receivedAt: null };
  return (
    <div className={styles.row}>
      <Caption1 className={late ? styles.late : undefined}>
        {late && <Glyph name="caution" className={styles.glyph} />}
        {partsSummary(line.parts ?? empty, nowMs, timeZone)}
      </Caption1>
      {canEdit && (
        <Button size="small" onClick={() => setOpen(true)} aria-label={`Parts for ${label}`}>
          Parts…
        </Button>
      )}
      {open && (
        <PartsDialog
          line={line}
          label={label}
          timeZone={timeZone ?? Intl.DateTimeFormat().resolvedOptions().timeZone}
          onClose={() => setOpen(false)}
        />
      )}
    </div>
  );
}

const draftSchema = z.object({
  part: z.string(),
  state: z.enum(PARTS_STATES).or(z.literal('')),
  supplier: z.string(),
  day: z.string(),
  time: z.string(),
});
type Draft = z.infer<typeof draftSchema>;

/** The typed fields as the body the server checks: the day and time are an instant in shop time. */
const partsFormSchema = (timeZone: string) =>
  checkedAsBody(
    draftSchema,
    (draft: Draft) => {
      const when =
        draft.day && /^\d{2}:\d{2}$/.test(draft.time)
          ? shopLocalInstant(draft.day, draft.time, timeZone)
          : null;
      return {
        part: draft.part,
        state: draft.state || null,
        supplier: draft.supplier.trim() || null,
        // Half a date or time is sent as it is, so the schema says what is wrong with it.
        expectedAt: when ? when.toISOString() : draft.day || draft.time ? `${draft.day}T${draft.time}` : null,
      };
    },
    partsDetailsSchema,
    { expectedAt: 'time' },
  );

function PartsDialog({
  line,
  label,
  timeZone,
  onClose,
}: {
  line: PartsLine;
  label: string;
  timeZone: string;
  onClose: () => void;
}) {
  const styles = useStyles();
  const save = useRecordParts(line.id);
  const receive = useReceiveParts(line.id);
  const form = useSchemaForm(partsFormSchema(timeZone), {
    defaultValues: {
      part: line.parts?.part ?? '',
      state: line.parts?.state ?? '',
      supplier: line.parts?.supplier ?? '',
      ...arrivalInputs(line.parts?.expectedAt ?? null, timeZone),
    },
  });
  const { errors } = form.formState;
  const formError = errors.root?.server?.message ?? null;
  const onSubmit = form.handleSubmit((body) =>
    save.mutate(body, {
      onSuccess: onClose,
      onError: (error) => showServerErrors(form, error, { expectedAt: 'time' }),
    }),
  );

  return (
    <Dialog open onOpenChange={(_, data) => !data.open && onClose()} modalType="modal">
      <DialogSurface className={styles.surface}>
        <form onSubmit={(event) => void onSubmit(event)} noValidate>
          <DialogBody>
            <DialogTitle>Parts for {label}</DialogTitle>
            <DialogContent className={styles.content}>
              <Field label="Part" required validationMessage={errors.part?.message}>
                <Input maxLength={120} {...form.register('part')} />
              </Field>
              <Field label="State" validationMessage={errors.state?.message}>
                <Select {...form.register('state')}>
                  <option value="">Not ordered yet</option>
                  {PARTS_STATES.map((state) => (
                    <option key={state} value={state}>
                      {PARTS_STATE_WORDS[state]}
                    </option>
                  ))}
                </Select>
              </Field>
              <Field label="Supplier" validationMessage={errors.supplier?.message}>
                <Input maxLength={80} {...form.register('supplier')} />
              </Field>
              <div className={styles.when}>
                <Field label="Expected on" hint={`Shop time (${timeZone})`}>
                  <Input type="date" {...form.register('day')} />
                </Field>
                <Field label="at" validationMessage={errors.time?.message}>
                  <Input type="time" {...form.register('time')} />
                </Field>
              </div>
              {(formError || receive.error) && (
                <MessageBar intent="error">
                  <MessageBarBody>{formError ?? formErrorText(receive.error)}</MessageBarBody>
                </MessageBar>
              )}
            </DialogContent>
            <DialogActions position="start">
              <Button
                onClick={() => receive.mutate(undefined, { onSuccess: onClose })}
                disabled={receive.isPending || save.isPending}
              >
                {receive.isPending ? 'Marking…' : 'Parts received'}
              </Button>
            </DialogActions>
            <DialogActions position="end">
              <Button appearance="secondary" onClick={onClose}>
                Cancel
              </Button>
              <Button appearance="primary" type="submit" disabled={save.isPending || receive.isPending}>
                {save.isPending ? 'Saving…' : 'Save'}
              </Button>
            </DialogActions>
          </DialogBody>
        </form>
      </DialogSurface>
    </Dialog>
  );
}
