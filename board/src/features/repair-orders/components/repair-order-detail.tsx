import { useState, type ReactNode } from 'react';
import { Link as RouterLink, useNavigate } from 'react-router';
import {
  Badge,
  Body1,
  Button,
  Caption1,
  Card,
  Link,
  MessageBar,
  MessageBarBody,
  Spinner,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  makeStyles,
  mergeClasses,
  tokens,
  useRestoreFocusTarget,
} from '@fluentui/react-components';
import { ApiError } from '@baytime/shared/client';
import { BAY_PALETTE, formatPhone } from '@baytime/shared';
import { ConfirmDialog } from '@/components/confirm-dialog';
import { PageHeader } from '@/components/page-header';
import { Glyph } from '@/components/glyph';
import { paths } from '@/config/paths';
import { formErrorText } from '@/lib/form-errors';
import { useRepairOrder } from '../api/get-repair-order';
import { useRepairOrderFindings } from '../api/get-findings';
import { useDispatch } from '@/lib/api/get-dispatch';
import type { RepairOrderSummary } from '../api/get-repair-orders';
import { bookTotal, lineNotes, lineRows, linesDone } from '../ro-model';
import { useRepairOrderHistory } from '../api/get-history';
import {
  useCloseRepairOrder,
  useDeleteJobLine,
  useRecordFinalCheck,
  useReorderLines,
  useSendReadyNotice,
} from '../api/repair-order-changes';
import { EditRepairOrderDialog } from './edit-repair-order-dialog';
import { AddLineDialog, CancelLineDialog, EditLineDialog, ReopenLineDialog } from './line-dialogs';
import { RepairOrderPrint } from './repair-order-print';
import {
  BAY_STATE_WORDS,
  JOB_LINE_STATUS_WORDS,
  REPAIR_ORDER_STATUS_WORDS,
  aboutWords,
  lineWithTitleWords,
  lineWords,
  sentToWords,
  skillWords,
} from '@baytime/shared';
import {
  formatBookHours,
  formatDateTime,
  formatHours,
  formatOdometer,
  formatOverUnder,
  groupVin,
  lineLabel,
} from '../ro-format';
import { FindingCard } from './finding-card';

const useStyles = makeStyles({
  page: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXL, maxWidth: '110rem' },
  facts: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fit, minmax(15rem, 1fr))',
    gap: `${tokens.spacingVerticalL} ${tokens.spacingHorizontalXXL}`,
    padding: tokens.spacingHorizontalXL,
  },
  fact: { display: 'flex', flexDirection: 'column', gap: '2px', minWidth: 0 },
  label: {
    color: tokens.colorNeutralForeground3,
    textTransform: 'uppercase',
    letterSpacing: '0.06em',
    marginBottom: '2px',
  },
  big: { fontSize: tokens.fontSizeBase400, fontWeight: tokens.fontWeightSemibold },
  vin: { fontFamily: tokens.fontFamilyMonospace, letterSpacing: '0.04em' },
  concern: { gridColumn: '1 / -1', whiteSpace: 'pre-wrap' },
  dim: { color: tokens.colorNeutralForeground3 },
  // A 24 px high target for each contact link (WCAG 2.2 target size), even when stacked.
  contact: { alignSelf: 'flex-start', minHeight: '24px', display: 'inline-flex', alignItems: 'center' },
  section: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
  sectionHead: { display: 'flex', alignItems: 'baseline', gap: tokens.spacingHorizontalM },
  scroll: { overflowX: 'auto' },
  table: { tableLayout: 'auto' },
  numeric: { fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap' },
  over: { color: tokens.colorPaletteRedForeground1, fontWeight: tokens.fontWeightSemibold },
  under: { color: tokens.colorStatusSuccessForeground1 },
  lineTitle: { fontWeight: tokens.fontWeightSemibold },
  status: { display: 'flex', flexDirection: 'column', alignItems: 'flex-start', gap: '2px' },
  cell: { display: 'inline-flex', alignItems: 'center', gap: '4px', whiteSpace: 'nowrap' },
  glyph: { width: '15px', height: '15px' },
  late: { color: tokens.colorPaletteRedForeground1, fontWeight: tokens.fontWeightSemibold },
  total: { fontWeight: tokens.fontWeightSemibold },
  findings: {
    display: 'grid',
    alignItems: 'start',
    gridTemplateColumns: 'repeat(auto-fill, minmax(26rem, 1fr))',
    gap: tokens.spacingHorizontalM,
  },
  history: {
    margin: 0,
    paddingLeft: 0,
    listStyle: 'none',
    display: 'flex',
    flexDirection: 'column',
    gap: '4px',
  },
  when: { display: 'inline-block', minWidth: '11rem', color: tokens.colorNeutralForeground3 },
  visit: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: tokens.spacingHorizontalM,
    padding: tokens.spacingHorizontalL,
  },
  threeCs: { display: 'flex', flexDirection: 'column', gap: '2px', marginTop: '2px', whiteSpace: 'pre-wrap' },
  lineActions: { display: 'flex', flexWrap: 'wrap', gap: '4px' },
  screenOnly: { '@media print': { display: 'none' } },
});

type LineDialog =
  | { kind: 'edit' | 'cancel' | 'reopen' | 'delete'; line: RepairOrderSummary['lines'][number] }
  | { kind: 'add' }
  | { kind: 'edit-ro' };

const STATUS_COLOURS = { open: 'brand', done: 'informative', closed: 'subtle' } as const;

const LINE_STATUS_COLOURS = {
  queued: 'informative',
  working: 'brand',
  held: 'important',
  done: 'subtle',
  cancelled: 'subtle',
} as const;

export interface RepairOrderDetailProps {
  id: number;
  timeZone: string | undefined;
  units: 'metric' | 'us' | undefined;
  /** Foreman and owner get a way to dispatch the lines. */
  canDispatch: boolean;
  /** Just written: say so. */
  created: boolean;
  /** Shown under a line's status (parts details for a line held for parts). */
  lineTools?: (line: RepairOrderSummary['lines'][number]) => ReactNode;
}

export function RepairOrderDetail(props: RepairOrderDetailProps) {
  if (!Number.isInteger(props.id) || props.id <= 0) return <Missing />;
  return <LoadedDetail {...props} />;
}

function Missing() {
  return (
    <>
      <PageHeader title="Repair order" />
      <MessageBar intent="warning">
        <MessageBarBody>
          There is no repair order at this address.{' '}
          <RouterLink to={paths.repairOrders}>All repair orders</RouterLink>
        </MessageBarBody>
      </MessageBar>
    </>
  );
}

function LoadedDetail(props: RepairOrderDetailProps) {
  const ro = useRepairOrder(props.id);
  if (ro.isPending)
    return (
      <>
        <PageHeader title="Repair order" />
        <Spinner label="Loading the repair order…" />
      </>
    );
  if (ro.isError) {
    if (ro.error instanceof ApiError && ro.error.status === 404) return <Missing />;
    return (
      <>
        <PageHeader title="Repair order" />
        <MessageBar intent="error">
          <MessageBarBody>
            {formErrorText(ro.error)}{' '}
            <Button size="small" onClick={() => void ro.refetch()}>
              Try again
            </Button>
          </MessageBarBody>
        </MessageBar>
      </>
    );
  }
  return <Detail ro={ro.data} {...props} />;
}

function Fact({ label, children, className }: { label: string; children: ReactNode; className?: string }) {
  const styles = useStyles();
  return (
    <div className={mergeClasses(styles.fact, className)}>
      <Caption1 className={styles.label}>{label}</Caption1>
      {children}
    </div>
  );
}

function Detail({
  ro,
  timeZone,
  units,
  canDispatch,
  created,
  lineTools,
}: RepairOrderDetailProps & { ro: RepairOrderSummary }) {
  const styles = useStyles();
  const navigate = useNavigate();
  const findings = useRepairOrderFindings(ro.id);
  const dispatch = useDispatch();
  const rows = lineRows(ro, dispatch.data, findings.data);
  const late = ro.late;
  const history = useRepairOrderHistory(ro.id);
  const [dialog, setDialog] = useState<LineDialog | null>(null);
  const restoreFocus = useRestoreFocusTarget();
  const reorder = useReorderLines(ro.id);
  const moveLine = (index: number, by: -1 | 1) => {
    const ids = ro.lines.map((line) => line.id);
    [ids[index], ids[index + by]] = [ids[index + by]!, ids[index]!];
    reorder.mutate(ids);
  };
  const book = bookTotal(ro.lines);
  const progress = linesDone(ro.lines);
  const clockedTotal = rows.reduce((sum, row) => sum + row.clockedSeconds, 0);

  return (
    <div className={styles.page}>
      <PageHeader
        title={`RO ${ro.number}`}
        description={`${ro.vehicle} · ${ro.customerName}`}
        actions={
          <>
            <Badge size="large" appearance="tint" color={STATUS_COLOURS[ro.status]}>
              {REPAIR_ORDER_STATUS_WORDS[ro.status]}
            </Badge>
            {late && (
              <Badge size="large" appearance="filled" color="danger">
                LATE
              </Badge>
            )}
            {canDispatch && ro.status === 'open' && (
              <Button onClick={() => void navigate(paths.dispatch)}>Open dispatch</Button>
            )}
            {ro.status !== 'closed' && (
              <Button onClick={() => setDialog({ kind: 'edit-ro' })}>Edit details</Button>
            )}
            <Button onClick={() => window.print()}>Print RO and job tickets</Button>
            <Button appearance="subtle" onClick={() => void navigate(paths.repairOrders)}>
              All repair orders
            </Button>
          </>
        }
      />
      {created && (
        <MessageBar intent="success">
          <MessageBarBody>
            RO {ro.number} is written. Its {ro.lines.length === 1 ? 'line waits' : 'lines wait'} in the
            dispatch queue.
          </MessageBarBody>
        </MessageBar>
      )}

      <VisitActions ro={ro} bay={dispatch.data?.bays.find((bay) => bay.repairOrderId === ro.id)} />

      <Card className={styles.facts}>
        <Fact label="Customer">
          <Body1 className={styles.big}>{ro.customerName}</Body1>
          {ro.customerPhone && (
            <Link className={styles.contact} href={`tel:${ro.customerPhone}`}>
              {formatPhone(ro.customerPhone)}
            </Link>
          )}
          {ro.customerEmail && (
            <Link className={styles.contact} href={`mailto:${ro.customerEmail}`}>
              {ro.customerEmail}
            </Link>
          )}
          {'customerPhone' in ro && !ro.customerPhone && !ro.customerEmail && (
            <Caption1 className={styles.dim}>No phone or e-mail on file</Caption1>
          )}
        </Fact>
        <Fact label="Vehicle">
          <Body1 className={styles.big}>{ro.vehicle}</Body1>
          <Body1 className={styles.vin} aria-label={`VIN ${ro.vin.split('').join(' ')}`}>
            {groupVin(ro.vin)}
          </Body1>
          <Body1>
            {formatOdometer(ro.odometer, units)}
            {ro.plate && ` · plate ${ro.plate}`}
          </Body1>
        </Fact>
        <Fact label="Promised">
          <Body1 className={mergeClasses(styles.big, late && styles.late)}>
            {ro.promisedAt ? formatDateTime(ro.promisedAt, timeZone) : 'No time promised'}
          </Body1>
          <Caption1 className={styles.dim}>
            Written {formatDateTime(ro.createdAt, timeZone)}
            {ro.advisorName && ` by ${ro.advisorName}`}
          </Caption1>
        </Fact>
        <Fact label="Labour">
          <Body1 className={styles.big}>{formatBookHours(book)} book</Body1>
          <Caption1 className={styles.dim}>
            {progress.done} of {progress.of} lines done
            {` · ${formatHours(clockedTotal)} clocked`}
          </Caption1>
        </Fact>
        <Fact label="Concern" className={styles.concern}>
          <Body1>{ro.concern}</Body1>
        </Fact>
      </Card>

      <section className={styles.section} aria-labelledby="ro-lines">
        <Subtitle2 as="h2" id="ro-lines">
          Job lines
        </Subtitle2>
        <div className={styles.scroll}>
          <Table className={styles.table} aria-labelledby="ro-lines" size="small">
            <TableHeader>
              <TableRow>
                <TableHeaderCell>Line</TableHeaderCell>
                <TableHeaderCell>Status</TableHeaderCell>
                <TableHeaderCell>Technician</TableHeaderCell>
                <TableHeaderCell>Bay</TableHeaderCell>
                <TableHeaderCell>Book</TableHeaderCell>
                <TableHeaderCell>Clocked</TableHeaderCell>
                <TableHeaderCell>Over / under</TableHeaderCell>
                <TableHeaderCell>Finish</TableHeaderCell>
                <TableHeaderCell>
                  <span className="visually-hidden">Changes</span>
                </TableHeaderCell>
              </TableRow>
            </TableHeader>
            <TableBody>
              {rows.map(
                ({ line, statusText, technician, bay, clockedSeconds, onTheClock, forecast }, index) => {
                  const over = clockedSeconds > line.bookHours * 3600 + 59;
                  const bayState = dispatch.data?.bays.find((b) => b.id === line.bayId)?.state;
                  return (
                    <TableRow key={line.id}>
                      <TableCell>
                        <span className={styles.lineTitle}>{lineLabel(line)}</span>
                        <Caption1 className={styles.dim}> · {skillWords(line.skillLevel)}</Caption1>
                        <div className={styles.threeCs}>
                          {lineNotes(line).map(({ label, text }) => (
                            <Caption1 key={label}>
                              {label}: {text}
                            </Caption1>
                          ))}
                        </div>
                      </TableCell>
                      <TableCell>
                        <div className={styles.status}>
                          <Badge appearance="tint" color={LINE_STATUS_COLOURS[line.status]}>
                            {statusText}
                          </Badge>
                          {onTheClock.length > 0 && (
                            <Caption1 className={styles.cell}>
                              <Glyph name="wrench" className={styles.glyph} />
                              {onTheClock.join(', ')} on the clock
                            </Caption1>
                          )}
                        </div>
                        {lineTools?.(line)}
                      </TableCell>
                      <TableCell>{technician ?? <span className={styles.dim}>No technician</span>}</TableCell>
                      <TableCell>
                        {bay ? (
                          <span className={styles.cell}>
                            {bayState && <Glyph name={BAY_PALETTE[bayState].icon} className={styles.glyph} />}
                            {bay}
                          </span>
                        ) : (
                          <span className={styles.dim}>—</span>
                        )}
                      </TableCell>
                      <TableCell className={styles.numeric}>{formatBookHours(line.bookHours)}</TableCell>
                      <TableCell className={styles.numeric}>{formatHours(clockedSeconds)}</TableCell>
                      <TableCell className={mergeClasses(styles.numeric, over ? styles.over : undefined)}>
                        {clockedSeconds === 0 && line.status === 'queued'
                          ? '—'
                          : formatOverUnder(clockedSeconds, line.bookHours, line.status === 'done')}
                      </TableCell>
                      <TableCell className={styles.numeric}>
                        {line.completedAt ? (
                          <>{`${JOB_LINE_STATUS_WORDS.done} ${formatDateTime(line.completedAt, timeZone)}`}</>
                        ) : forecast ? (
                          <span className={line.late ? styles.late : undefined}>
                            {aboutWords(formatDateTime(forecast.finishAt, timeZone))}
                            {line.late && ' · LATE'}
                          </span>
                        ) : (
                          <span className={styles.dim}>
                            {line.status === 'held'
                              ? 'On hold'
                              : line.technicianId === null
                                ? 'Not assigned'
                                : '—'}
                          </span>
                        )}
                      </TableCell>
                      <TableCell>
                        <div className={styles.lineActions}>
                          {ro.status !== 'closed' && (
                            <Button size="small" onClick={() => setDialog({ kind: 'edit', line })}>
                              Edit
                            </Button>
                          )}
                          {canDispatch && line.status === 'done' && ro.status !== 'closed' && (
                            <Button size="small" onClick={() => setDialog({ kind: 'reopen', line })}>
                              Reopen (comeback)…
                            </Button>
                          )}
                          {line.status !== 'done' &&
                            line.status !== 'cancelled' &&
                            ro.status !== 'closed' && (
                              <Button
                                size="small"
                                {...restoreFocus}
                                onClick={() =>
                                  setDialog({ kind: clockedSeconds > 0 ? 'cancel' : 'delete', line })
                                }
                              >
                                {clockedSeconds > 0 ? 'Cancel…' : 'Delete…'}
                              </Button>
                            )}
                          <Button
                            size="small"
                            appearance="subtle"
                            aria-label={`Move ${lineWords(line.lineNo)} up`}
                            disabled={index === 0 || reorder.isPending || ro.status === 'closed'}
                            onClick={() => moveLine(index, -1)}
                          >
                            ↑
                          </Button>
                          <Button
                            size="small"
                            appearance="subtle"
                            aria-label={`Move ${lineWords(line.lineNo)} down`}
                            disabled={
                              index === rows.length - 1 || reorder.isPending || ro.status === 'closed'
                            }
                            onClick={() => moveLine(index, 1)}
                          >
                            ↓
                          </Button>
                        </div>
                      </TableCell>
                    </TableRow>
                  );
                },
              )}
              <TableRow>
                <TableCell className={styles.total}>Total</TableCell>
                <TableCell />
                <TableCell />
                <TableCell />
                <TableCell className={mergeClasses(styles.numeric, styles.total)}>
                  {formatBookHours(book)}
                </TableCell>
                <TableCell className={mergeClasses(styles.numeric, styles.total)}>
                  {formatHours(clockedTotal)}
                </TableCell>
                <TableCell />
                <TableCell />
                <TableCell />
              </TableRow>
            </TableBody>
          </Table>
        </div>
        {ro.status !== 'closed' && (
          <div>
            <Button onClick={() => setDialog({ kind: 'add' })}>Add a job line</Button>
          </div>
        )}
      </section>

      <section className={styles.section} aria-labelledby="ro-findings">
        <div className={styles.sectionHead}>
          <Subtitle2 as="h2" id="ro-findings">
            Findings
          </Subtitle2>
          {findings.data && findings.data.length > 0 && (
            <Caption1 className={styles.dim}>
              {findings.data.filter((f) => f.answer === 'pending').length} waiting for an answer
            </Caption1>
          )}
        </div>
        {findings.isPending ? (
          <Spinner size="small" label="Loading findings…" />
        ) : findings.isError ? (
          <MessageBar intent="error">
            <MessageBarBody>{formErrorText(findings.error)}</MessageBarBody>
          </MessageBar>
        ) : findings.data.length === 0 ? (
          <Body1 className={styles.dim}>No findings on this repair order.</Body1>
        ) : (
          <div className={styles.findings}>
            {findings.data.map((finding) => (
              <FindingCard key={finding.id} finding={finding} timeZone={timeZone} />
            ))}
          </div>
        )}
      </section>

      <section className={styles.section} aria-labelledby="ro-history">
        <Subtitle2 as="h2" id="ro-history">
          History
        </Subtitle2>
        {history.isPending ? (
          <Spinner size="small" label="Loading the history…" />
        ) : history.isError ? (
          <MessageBar intent="error">
            <MessageBarBody>{formErrorText(history.error)}</MessageBarBody>
          </MessageBar>
        ) : history.data.length === 0 ? (
          <Body1 className={styles.dim}>No changes since the RO was written.</Body1>
        ) : (
          <ul className={styles.history}>
            {[...history.data].reverse().map((entry, index) => (
              <li key={`${entry.at}-${index}`}>
                <Caption1 className={styles.when}>{formatDateTime(entry.at, timeZone)}</Caption1>
                <Body1>
                  {entry.text}
                  {entry.actorName && <span className={styles.dim}> · {entry.actorName}</span>}
                </Body1>
              </li>
            ))}
          </ul>
        )}
      </section>

      <RepairOrderPrint ro={ro} units={units} timeZone={timeZone} />

      {dialog?.kind === 'edit-ro' && (
        <EditRepairOrderDialog ro={ro} timeZone={timeZone} onClose={() => setDialog(null)} />
      )}
      {dialog?.kind === 'add' && (
        <AddLineDialog repairOrderId={ro.id} concern={ro.concern} onClose={() => setDialog(null)} />
      )}
      {dialog?.kind === 'edit' && (
        <EditLineDialog repairOrderId={ro.id} line={dialog.line} onClose={() => setDialog(null)} />
      )}
      {dialog?.kind === 'cancel' && (
        <CancelLineDialog repairOrderId={ro.id} line={dialog.line} onClose={() => setDialog(null)} />
      )}
      {dialog?.kind === 'delete' && (
        <DeleteLineDialog
          repairOrderId={ro.id}
          line={dialog.line}
          onRefused={() => setDialog({ kind: 'cancel', line: dialog.line })}
          onClose={() => setDialog(null)}
        />
      )}
      {dialog?.kind === 'reopen' && (
        <ReopenLineDialog repairOrderId={ro.id} line={dialog.line} onClose={() => setDialog(null)} />
      )}
    </div>
  );
}

/** A line written by mistake leaves the RO for good: asked first, as nothing brings it back. */
function DeleteLineDialog({
  repairOrderId,
  line,
  onRefused,
  onClose,
}: {
  repairOrderId: number;
  line: RepairOrderSummary['lines'][number];
  onRefused: () => void;
  onClose: () => void;
}) {
  const removeLine = useDeleteJobLine(repairOrderId);
  return (
    <ConfirmDialog
      title={`Delete ${lineWithTitleWords(line.lineNo, line.title)}?`}
      confirmLabel="Delete the line"
      pendingLabel="Deleting…"
      keepLabel="Keep the line"
      pending={removeLine.isPending}
      error={removeLine.error ? formErrorText(removeLine.error) : null}
      onConfirm={() =>
        removeLine.mutate(line.id, {
          onSuccess: onClose,
          // Time, a finding or a timer on it that this page had not seen: it can only be cancelled.
          onError: (error) => error instanceof ApiError && error.status === 409 && onRefused(),
        })
      }
      onClose={onClose}
    >
      It has no clocked time, so it leaves the RO: it is gone from the dispatch queue and the job tickets. The
      history keeps a note that it was removed.
    </ConfirmDialog>
  );
}

/**
 * The end of the visit, in order: the final check of the bay holding the vehicle, the ready notice
 * once the work is done, and the pick-up that closes the RO and frees the bay.
 */
function VisitActions({
  ro,
  bay,
}: {
  ro: RepairOrderSummary;
  bay: { id: number; name: string; state: string } | undefined;
}) {
  const styles = useStyles();
  const finalCheck = useRecordFinalCheck(ro.id);
  const notice = useSendReadyNotice(ro.id);
  const close = useCloseRepairOrder(ro.id);
  const [confirmingClose, setConfirmingClose] = useState(false);
  const restoreFocus = useRestoreFocusTarget();
  const failed = finalCheck.error ?? notice.error;
  if (ro.status === 'closed')
    return (
      <MessageBar intent="info">
        <MessageBarBody>Picked up: this repair order is closed.</MessageBarBody>
      </MessageBar>
    );
  if (ro.status !== 'done' && bay?.state !== 'check') return null;
  return (
    <Card
      className={mergeClasses(styles.visit, styles.screenOnly)}
      role="group"
      aria-label="End of the visit"
    >
      {bay?.state === 'check' && (
        <Button disabled={finalCheck.isPending} onClick={() => finalCheck.mutate(bay.id)}>
          {BAY_STATE_WORDS.check} done: {bay.name} ready
        </Button>
      )}
      {ro.status === 'done' && (
        <>
          <Button
            disabled={notice.isPending || (!ro.customerEmail && !ro.customerPhone)}
            onClick={() => notice.mutate()}
          >
            {notice.isPending ? 'Sending…' : 'Tell the customer: vehicle ready'}
          </Button>
          <Button
            appearance="primary"
            disabled={close.isPending}
            {...restoreFocus}
            onClick={() => setConfirmingClose(true)}
          >
            Vehicle picked up: close the RO
          </Button>
        </>
      )}
      {notice.isSuccess && (
        <Caption1 role="status">
          Ready notice sent {sentToWords(notice.data.mail?.to, notice.data.text?.to)}.
        </Caption1>
      )}
      {!ro.customerEmail && !ro.customerPhone && ro.status === 'done' && (
        <Caption1>No e-mail or phone on file: tell the customer at the counter.</Caption1>
      )}
      {failed && <Caption1 role="alert">{formErrorText(failed)}</Caption1>}
      {confirmingClose && (
        <ConfirmDialog
          title={`Close RO ${ro.number} as picked up?`}
          confirmLabel="Close the RO"
          pendingLabel="Closing…"
          keepLabel="Keep it open"
          pending={close.isPending}
          error={close.error ? formErrorText(close.error) : null}
          onConfirm={() => close.mutate(undefined, { onSuccess: () => setConfirmingClose(false) })}
          onClose={() => setConfirmingClose(false)}
        >
          The vehicle has left the shop. The RO closes, and its lines can no longer be worked or changed
          {bay ? `; ${bay.name} is free for the next vehicle.` : '.'}
        </ConfirmDialog>
      )}
    </Card>
  );
}
