import {
  Badge,
  Body1,
  Caption1,
  Card,
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
} from '@fluentui/react-components';
import {
  CONNECTION_WORDS,
  JOB_LINE_STATUS_WORDS,
  PERSON_STATUS_WORDS,
  PRIORITY_WORDS,
  TIMER_KIND_LABELS,
  atStart,
  formatHours,
  lineWords,
  offlineSinceWords,
  waitWords,
  type BoardBay,
  type BoardSnapshot,
} from '@baytime/shared';
import { StateChip } from '@/components/state-chip';
import { clockedSecondsAt } from '../board-store';
import { clockedBar, countdownFact, holdFacts } from '../bay-facts';
import { formatTimeOfDay } from '../board-time';
import type { LinkStatus } from '../live-board';
import { LINK_LOST_AFTER_MS } from './wall-top-bar';

const useStyles = makeStyles({
  table: { tableLayout: 'auto' },
  // Long job titles wrap rather than being cut.
  where: { display: 'block', maxWidth: '18rem' },
  status: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalM, flexWrap: 'wrap' },
  bays: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(17rem, 1fr))',
    gap: tokens.spacingHorizontalM,
    marginBottom: tokens.spacingVerticalXXL,
  },
  card: { gap: tokens.spacingVerticalXS, padding: tokens.spacingHorizontalM },
  free: { opacity: 0.75 },
  cardHead: {
    display: 'flex',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: tokens.spacingHorizontalS,
  },
  bayName: { fontSize: tokens.fontSizeBase500, fontWeight: tokens.fontWeightBold },
  dim: { color: tokens.colorNeutralForeground3 },
  row: { display: 'flex', justifyContent: 'space-between', gap: tokens.spacingHorizontalS },
  wraps: { minWidth: 0, overflowWrap: 'anywhere' },
  bar: {
    position: 'relative',
    height: '8px',
    borderRadius: '4px',
    backgroundColor: tokens.colorNeutralBackground5,
    marginTop: tokens.spacingVerticalXS,
  },
  within: {
    position: 'absolute',
    top: 0,
    bottom: 0,
    left: 0,
    borderRadius: '4px 0 0 4px',
    backgroundColor: tokens.colorCompoundBrandBackground,
  },
  over: {
    position: 'absolute',
    top: 0,
    bottom: 0,
    backgroundImage: `repeating-linear-gradient(-45deg, ${tokens.colorStatusWarningBackground3} 0 4px, transparent 4px 8px)`,
  },
  book: {
    position: 'absolute',
    top: '-3px',
    bottom: '-3px',
    width: '2px',
    marginLeft: '-1px',
    backgroundColor: tokens.colorNeutralForeground1,
  },
  overText: { color: tokens.colorPaletteRedForeground1, fontWeight: tokens.fontWeightSemibold },
  lower: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fit, minmax(24rem, 1fr))',
    gap: tokens.spacingHorizontalXXL,
  },
  sectionTitle: { display: 'block', marginBottom: tokens.spacingVerticalS },
});

export interface FloorViewProps {
  snapshot: BoardSnapshot;
  bayAsOf: Readonly<Record<number, number>>;
  /** Server time now (ms). */
  nowMs: number;
}

export function FloorLinkStatus({
  link,
  downSince,
  localNowMs,
  offsetMs,
  timeZone,
}: {
  link: LinkStatus;
  downSince: number | null;
  localNowMs: number;
  offsetMs: number;
  timeZone: string | undefined;
}) {
  const styles = useStyles();
  const lost = link !== 'live' && downSince !== null && localNowMs - downSince >= LINK_LOST_AFTER_MS;
  return (
    <span className={styles.status} role="status">
      {link === 'live' ? (
        <Badge appearance="tint" color="brand">
          {CONNECTION_WORDS.online}
        </Badge>
      ) : lost ? (
        <Badge appearance="filled" color="danger">
          {offlineSinceWords(formatTimeOfDay(downSince + offsetMs, timeZone))}
        </Badge>
      ) : (
        <Badge appearance="tint" color="informative">
          {CONNECTION_WORDS.connecting}
        </Badge>
      )}
    </span>
  );
}

interface BayCardProps {
  bay: BoardBay;
  asOfMs: number | undefined;
  nowMs: number;
  timeZone: string;
}

function BayCard({ bay, asOfMs, nowMs, timeZone }: BayCardProps) {
  const styles = useStyles();
  const clocked = clockedSecondsAt(bay, asOfMs, nowMs);
  const bar = clockedBar(clocked, bay.bookSeconds);
  const timer = bay.timer;
  const countdown = timer ? countdownFact(timer, nowMs) : null;
  return (
    <Card className={mergeClasses(styles.card, bay.state === 'free' && styles.free)} aria-label={bay.name}>
      <div className={styles.cardHead}>
        <span className={styles.bayName}>{bay.name}</span>
        <StateChip state={bay.state} />
      </div>
      {bay.state === 'held' && (
        <Body1>
          <strong>
            {holdFacts(bay, nowMs, timeZone)
              .map((fact) => fact.text)
              .join(' ')}
          </strong>
          {bay.heldSince && ` · held ${waitWords(Date.parse(bay.heldSince), nowMs)}`}
        </Body1>
      )}
      {timer && (
        <Body1>
          <strong>{TIMER_KIND_LABELS[timer.kind]}</strong>
          {timer.note && ` (${timer.note})`}
          {countdown && ` · ${countdown.text}${countdown.suffix ? ` ${countdown.suffix}` : ''}`}
          {timer.lastReadingC !== null && timer.targetC !== null && (
            <span className={styles.dim}>
              {' '}
              ({Math.round(timer.lastReadingC)}°C → {Math.round(timer.targetC)}°C)
            </span>
          )}
        </Body1>
      )}
      {(bay.vehicle || bay.repairOrder) && (
        <div className={styles.row}>
          <Body1 className={styles.wraps}>{bay.vehicle ?? '—'}</Body1>
          {bay.repairOrder && <Body1 className={styles.dim}>RO {bay.repairOrder.number}</Body1>}
        </div>
      )}
      {bay.jobLine && (
        <Body1 className={styles.wraps}>
          <span className={styles.dim}>{atStart(lineWords(bay.jobLine.lineNo))} </span>
          {bay.jobLine.title}
        </Body1>
      )}
      {bay.technicians.length > 0 && <Body1>{bay.technicians.map((tech) => tech.name).join(', ')}</Body1>}
      {bar && (
        <>
          <div className={styles.row}>
            <Caption1>
              {formatHours(clocked)} clocked of {formatHours(bay.bookSeconds)} book
            </Caption1>
            {bar.overSeconds > 0 && (
              <Caption1 className={styles.overText}>+{formatHours(bar.overSeconds)} over</Caption1>
            )}
          </div>
          <div
            className={styles.bar}
            role="img"
            aria-label={`${formatHours(clocked)} clocked of ${formatHours(bay.bookSeconds)} book`}
          >
            <div className={styles.within} style={{ width: `${bar.withinBook * 100}%` }} />
            {bar.overBook > 0 && (
              <div
                className={styles.over}
                style={{ left: `${bar.bookMark * 100}%`, width: `${bar.overBook * 100}%` }}
              />
            )}
            <div className={styles.book} style={{ left: `${bar.bookMark * 100}%` }} />
          </div>
        </>
      )}
    </Card>
  );
}

const PRIORITY_COLOURS = {
  urgent: 'danger',
  high: 'important',
  normal: 'informative',
  low: 'subtle',
} as const;

/** The live floor at office size: bay cards, then who is where and what waits. */
export function FloorView({ snapshot, bayAsOf, nowMs }: FloorViewProps) {
  const styles = useStyles();
  return (
    <>
      <section aria-label="Bays" className={styles.bays}>
        {snapshot.bays.map((bay) => (
          <BayCard
            key={bay.id}
            bay={bay}
            asOfMs={bayAsOf[bay.id]}
            nowMs={nowMs}
            timeZone={snapshot.shop.timeZone}
          />
        ))}
        {snapshot.bays.length === 0 && <Body1>No bays yet. The owner adds them under Admin, Bays.</Body1>}
      </section>
      <div className={styles.lower}>
        <section aria-labelledby="floor-people">
          <Subtitle2 id="floor-people" className={styles.sectionTitle}>
            On shift ({snapshot.people.length})
          </Subtitle2>
          {snapshot.people.length === 0 ? (
            <Body1 className={styles.dim}>Nobody is on shift.</Body1>
          ) : (
            <Table size="small" aria-labelledby="floor-people" className={styles.table}>
              <TableHeader>
                <TableRow>
                  <TableHeaderCell>Technician</TableHeaderCell>
                  <TableHeaderCell>Status</TableHeaderCell>
                  <TableHeaderCell>Where</TableHeaderCell>
                  <TableHeaderCell>For</TableHeaderCell>
                </TableRow>
              </TableHeader>
              <TableBody>
                {snapshot.people.map((person) => (
                  <TableRow key={person.id}>
                    <TableCell>{person.name}</TableCell>
                    <TableCell>
                      <Badge
                        appearance={person.status === 'idle' ? 'outline' : 'tint'}
                        color={
                          person.status === 'idle'
                            ? 'important'
                            : person.status === 'on-job'
                              ? 'brand'
                              : 'informative'
                        }
                      >
                        {PERSON_STATUS_WORDS[person.status]}
                      </Badge>
                    </TableCell>
                    <TableCell>
                      <span className={styles.where}>
                        {[person.bayName, person.jobLineTitle].filter(Boolean).join(' · ') || '—'}
                      </span>
                    </TableCell>
                    <TableCell>{waitWords(Date.parse(person.since), nowMs)}</TableCell>
                  </TableRow>
                ))}
              </TableBody>
            </Table>
          )}
        </section>
        <section aria-labelledby="floor-queue">
          <Subtitle2 id="floor-queue" className={styles.sectionTitle}>
            {JOB_LINE_STATUS_WORDS.queued} ({snapshot.queue.length})
          </Subtitle2>
          {snapshot.queue.length === 0 ? (
            <Body1 className={styles.dim}>Nothing waits.</Body1>
          ) : (
            <Table size="small" aria-labelledby="floor-queue" className={styles.table}>
              <TableHeader>
                <TableRow>
                  <TableHeaderCell>RO</TableHeaderCell>
                  <TableHeaderCell>Job line</TableHeaderCell>
                  <TableHeaderCell>Priority</TableHeaderCell>
                  <TableHeaderCell>For</TableHeaderCell>
                </TableRow>
              </TableHeader>
              <TableBody>
                {[...snapshot.queue]
                  .sort((a, b) => Date.parse(a.waitingSince) - Date.parse(b.waitingSince))
                  .map((item) => (
                    <TableRow key={item.jobLineId}>
                      <TableCell>{item.repairOrderNumber}</TableCell>
                      <TableCell>{item.title}</TableCell>
                      <TableCell>
                        <Badge appearance="tint" color={PRIORITY_COLOURS[item.priority]}>
                          {PRIORITY_WORDS[item.priority]}
                        </Badge>
                      </TableCell>
                      <TableCell>{waitWords(Date.parse(item.waitingSince), nowMs)}</TableCell>
                    </TableRow>
                  ))}
              </TableBody>
            </Table>
          )}
        </section>
      </div>
    </>
  );
}
