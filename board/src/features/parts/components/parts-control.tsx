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
  type PartsState,
} from '@baytime/shared';
import { Glyph } from '@/components/glyph';
import { useCheckedSubmit } from '@/hooks/use-checked-submit';
import { formErrorText } from '@/lib/form-errors';
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

interface Draft {
  part: string;
  state: PartsState | '';
  supplier: string;
  day: string;
  time: string;
}

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
  const [draft, setDraft] = useState<Draft>(() => ({
    part: line.parts?.part ?? '',
    state: line.parts?.state ?? '',
    supplier: line.parts?.supplier ?? '',
    ...arrivalInputs(line.parts?.expectedAt ?? null, timeZone),
  }));
  const { errors, formError, submit } = useCheckedSubmit(partsDetailsSchema, save);
  const set = <K extends keyof Draft>(key: K, value: Draft[K]) => setDraft((d) => ({ ...d, [key]: value }));

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    const when =
      draft.day && /^\d{2}:\d{2}$/.test(draft.time)
        ? shopLocalInstant(draft.day, draft.time, timeZone)
        : null;
    submit(
      {
        part: draft.part,
        state: draft.state || null,
        supplier: draft.supplier.trim() || null,
        // Half a date or time is sent as it is, so the schema says what is wrong with it.
        expectedAt: when ? when.toISOString() : draft.day || draft.time ? `${draft.day}T${draft.time}` : null,
      },
      onClose,
    );
  };

  return (
    <Dialog open onOpenChange={(_, data) => !data.open && onClose()} modalType="modal">
      <DialogSurface className={styles.surface}>
        <form onSubmit={onSubmit} noValidate>
          <DialogBody>
            <DialogTitle>Parts for {label}</DialogTitle>
            <DialogContent className={styles.content}>
              <Field label="Part" required validationMessage={errors.part}>
                <Input value={draft.part} onChange={(_, data) => set('part', data.value)} maxLength={120} />
              </Field>
              <Field label="State" validationMessage={errors.state}>
                <Select
                  value={draft.state}
                  onChange={(_, data) => set('state', data.value as PartsState | '')}
                >
                  <option value="">Not ordered yet</option>
                  {PARTS_STATES.map((state) => (
                    <option key={state} value={state}>
                      {PARTS_STATE_WORDS[state]}
                    </option>
                  ))}
                </Select>
              </Field>
              <Field label="Supplier" validationMessage={errors.supplier}>
                <Input
                  value={draft.supplier}
                  onChange={(_, data) => set('supplier', data.value)}
                  maxLength={80}
                />
              </Field>
              <div className={styles.when}>
                <Field label="Expected on" hint={`Shop time (${timeZone})`}>
                  <Input type="date" value={draft.day} onChange={(_, data) => set('day', data.value)} />
                </Field>
                <Field label="at" validationMessage={errors.expectedAt}>
                  <Input type="time" value={draft.time} onChange={(_, data) => set('time', data.value)} />
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
