import { useEffect, useRef, type CSSProperties, type ReactNode } from 'react';
import { useDraggable } from '@dnd-kit/core';
import { Badge, Caption1, Spinner, Text, makeStyles, mergeClasses, tokens } from '@fluentui/react-components';
import {
  repairOrderLineWords,
  BAY_PALETTE,
  HOLD_REASON_LABELS,
  JOB_LINE_STATUS_WORDS,
  aboutWords,
  skillWords,
  waitWords,
  type DispatchBoard,
  type DispatchLine,
} from '@baytime/shared';
import { Glyph } from '@/components/glyph';
import { findLane, firstName, skillWarning, type MoveTarget } from '../dispatch-model';
import { formatBookHours, formatHours, formatShopTime } from '../dispatch-format';
import { PRIORITY_LABELS } from '../dispatch-words';
import { useLineTools } from './line-tools';
import { MoveMenu } from './move-menu';

const useStyles = makeStyles({
  card: {
    position: 'relative',
    display: 'flex',
    flexDirection: 'column',
    gap: '3px',
    padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalS} ${tokens.spacingVerticalS} ${tokens.spacingHorizontalM}`,
    borderRadius: tokens.borderRadiusMedium,
    backgroundColor: tokens.colorNeutralBackground1,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    boxShadow: tokens.shadow2,
    touchAction: 'manipulation',
    // The accent strip on the left says the line's state together with the words on the card.
    '::before': {
      content: '""',
      position: 'absolute',
      left: 0,
      top: 0,
      bottom: 0,
      width: '5px',
      borderRadius: `${tokens.borderRadiusMedium} 0 0 ${tokens.borderRadiusMedium}`,
      backgroundColor: 'var(--bt-accent, transparent)',
    },
  },
  draggable: { cursor: 'grab' },
  dragging: { opacity: 0.35 },
  overlay: { cursor: 'grabbing', boxShadow: tokens.shadow28, transform: 'rotate(1.5deg)' },
  late: { border: `${tokens.strokeWidthThick} solid ${tokens.colorPaletteRedBorder2}` },
  top: {
    display: 'flex',
    alignItems: 'center',
    gap: tokens.spacingHorizontalS,
    minHeight: '24px',
  },
  ro: { fontWeight: tokens.fontWeightSemibold, fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap' },
  vehicle: {
    flexGrow: 1,
    minWidth: 0,
    color: tokens.colorNeutralForeground3,
    overflow: 'hidden',
    textOverflow: 'ellipsis',
    whiteSpace: 'nowrap',
  },
  title: {
    fontSize: tokens.fontSizeBase400,
    lineHeight: tokens.lineHeightBase400,
    fontWeight: tokens.fontWeightSemibold,
    display: '-webkit-box',
    WebkitLineClamp: 2,
    WebkitBoxOrient: 'vertical',
    overflow: 'hidden',
  },
  tags: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', gap: `2px ${tokens.spacingHorizontalS}` },
  tag: { display: 'inline-flex', alignItems: 'center', gap: '4px', whiteSpace: 'nowrap' },
  glyph: { width: '15px', height: '15px', flexShrink: 0 },
  warn: { color: tokens.colorStatusWarningForeground1, fontWeight: tokens.fontWeightSemibold },
  dim: { color: tokens.colorNeutralForeground3 },
  facts: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: `2px ${tokens.spacingHorizontalM}`,
  },
  numbers: { fontVariantNumeric: 'tabular-nums' },
  bar: {
    position: 'relative',
    height: '6px',
    borderRadius: '3px',
    overflow: 'hidden',
    backgroundColor: tokens.colorNeutralBackground5,
  },
  within: { position: 'absolute', top: 0, bottom: 0, left: 0, backgroundColor: tokens.colorBrandBackground },
  over: {
    position: 'absolute',
    top: 0,
    bottom: 0,
    backgroundImage: `repeating-linear-gradient(-45deg, ${tokens.colorStatusWarningBackground3} 0 4px, transparent 4px 8px)`,
  },
  overText: { color: tokens.colorPaletteRedForeground1, fontWeight: tokens.fontWeightSemibold },
  lateText: { color: tokens.colorPaletteRedForeground1, fontWeight: tokens.fontWeightSemibold },
});

export interface LineCardProps {
  line: DispatchLine;
  board: DispatchBoard;
  /** Where the card sits: the queue shows waits, a lane shows progress and forecast. */
  place: 'queue' | 'lane';
  timeZone: string | undefined;
  nowMs: number;
  canEdit: boolean;
  onMove: (lineId: number, target: MoveTarget) => void;
  /** A move for this line is on its way to the server. */
  pending?: boolean;
  /** Put the keyboard focus on the card's menu button when it appears (after a move). */
  focusMenu?: boolean;
  onFocused?: () => void;
  /** The copy that follows the pointer while dragging. */
  overlay?: boolean;
}

function accentFor(line: DispatchLine): string | undefined {
  if (line.status === 'held') return BAY_PALETTE.held.colour;
  if (line.clockedOn.length > 0) return BAY_PALETTE.working.colour;
  return undefined;
}

function Tag({ children, className }: { children: ReactNode; className?: string }) {
  const styles = useStyles();
  return <Caption1 className={mergeClasses(styles.tag, className)}>{children}</Caption1>;
}

/** One job line: which RO and car, what to do, who is on it, and when it should be done. */
export function LineCard({
  line,
  board,
  place,
  timeZone,
  nowMs,
  canEdit,
  onMove,
  pending = false,
  focusMenu = false,
  onFocused,
  overlay = false,
}: LineCardProps) {
  const styles = useStyles();
  const { setNodeRef, listeners, isDragging } = useDraggable({
    id: `line:${line.id}`,
    data: { lineId: line.id },
    disabled: !canEdit || overlay,
  });
  const menuRef = useRef<HTMLButtonElement>(null);
  const lineTools = useLineTools();

  useEffect(() => {
    if (!focusMenu) return;
    // After the menu has closed and handed focus back to where it was opened (a card that may be gone).
    const timer = setTimeout(() => {
      menuRef.current?.focus();
      onFocused?.();
    }, 60);
    return () => clearTimeout(timer);
  }, [focusMenu, onFocused]);

  const lane = findLane(board, line.technicianId);
  const bay = line.bayId === null ? undefined : board.bays.find((b) => b.id === line.bayId);
  const onIt = line.clockedOn.map((id) => {
    const other = findLane(board, id);
    return other ? firstName(other.technician.name) : `#${id}`;
  });
  const warning = lane ? skillWarning(line, lane) : null;
  const book = line.bookHours * 3600;
  const late = line.forecast?.late ?? false;

  return (
    <article
      ref={overlay ? undefined : setNodeRef}
      {...(overlay ? {} : listeners)}
      className={mergeClasses(
        styles.card,
        canEdit && styles.draggable,
        isDragging && styles.dragging,
        overlay && styles.overlay,
        late && styles.late,
      )}
      style={{ '--bt-accent': accentFor(line) } as CSSProperties}
      aria-label={`RO ${line.repairOrderNumber} line ${line.lineNo}: ${line.title}${late ? ', forecast late' : ''}`}
    >
      <div className={styles.top}>
        <Caption1 className={styles.ro}>{repairOrderLineWords(line.repairOrderNumber, line.lineNo)}</Caption1>
        <Caption1 className={styles.vehicle}>{line.vehicle}</Caption1>
        {pending && <Spinner size="extra-tiny" aria-label="Saving" />}
        {late && (
          <Badge appearance="filled" color="danger" icon={<Glyph name="caution" className={styles.glyph} />}>
            LATE
          </Badge>
        )}
        {canEdit && !overlay && (
          <MoveMenu ref={menuRef} line={line} board={board} onMove={(target) => onMove(line.id, target)} />
        )}
      </div>
      <Text className={styles.title}>{line.title}</Text>
      <div className={styles.tags}>
        {line.priority !== 'normal' && (
          <Badge
            appearance={line.priority === 'urgent' ? 'filled' : 'tint'}
            color={line.priority === 'low' ? 'subtle' : 'danger'}
            icon={line.priority === 'low' ? undefined : <Glyph name="priority" className={styles.glyph} />}
          >
            {PRIORITY_LABELS[line.priority]}
          </Badge>
        )}
        {line.status === 'held' && (
          <Tag>
            <Glyph name="pause" className={styles.glyph} />
            <span>
              <strong>{JOB_LINE_STATUS_WORDS.held}</strong>
              {line.holdReason && `: ${HOLD_REASON_LABELS[line.holdReason]}`}
            </span>
          </Tag>
        )}
        {onIt.length > 0 && (
          <Tag>
            <Glyph name="wrench" className={styles.glyph} />
            <span>
              <strong>{onIt.join(', ')}</strong> on the clock
            </span>
          </Tag>
        )}
        {line.status === 'working' && onIt.length === 0 && (
          <Tag className={styles.dim}>{JOB_LINE_STATUS_WORDS.working} · nobody clocked on</Tag>
        )}
        {bay && (
          <Tag>
            <Glyph name={BAY_PALETTE[bay.state].icon} className={styles.glyph} />
            {bay.name}
          </Tag>
        )}
        {place === 'queue' && line.technicianId !== null && (
          <Tag className={styles.warn}>
            <Glyph name="caution" className={styles.glyph} />
            Technician no longer active: reassign
          </Tag>
        )}
        {place === 'queue' ? (
          <Tag>Needs {skillWords(line.skillLevel)}</Tag>
        ) : (
          warning && (
            <Tag className={styles.warn}>
              <Glyph name="caution" className={styles.glyph} />
              {warning}
            </Tag>
          )
        )}
      </div>
      {place === 'queue' ? (
        <div className={styles.facts}>
          <Caption1 className={styles.numbers}>
            <strong>{formatBookHours(line.bookHours)}</strong> book
            {line.clockedSeconds > 0 && ` · ${formatHours(line.clockedSeconds)} clocked`}
          </Caption1>
          <Caption1 className={styles.numbers}>
            {line.promisedAt ? `Promised ${formatShopTime(line.promisedAt, nowMs, timeZone)}` : 'No promise'}
            {' · '}waiting {waitWords(Date.parse(line.queuedAt), nowMs)}
          </Caption1>
        </div>
      ) : (
        <LaneFacts line={line} book={book} late={late} timeZone={timeZone} nowMs={nowMs} />
      )}
      {!overlay && lineTools?.(line)}
    </article>
  );
}

function LaneFacts({
  line,
  book,
  late,
  timeZone,
  nowMs,
}: {
  line: DispatchLine;
  book: number;
  late: boolean;
  timeZone: string | undefined;
  nowMs: number;
}) {
  const styles = useStyles();
  const clocked = line.clockedSeconds;
  const scale = Math.max(book, clocked, 1);
  const over = Math.max(0, clocked - book);
  return (
    <>
      <div
        className={styles.bar}
        role="img"
        aria-label={`${formatHours(clocked)} clocked of ${formatHours(book)} book`}
      >
        <div className={styles.within} style={{ width: `${(Math.min(clocked, book) / scale) * 100}%` }} />
        {over > 0 && (
          <div
            className={styles.over}
            style={{ left: `${(book / scale) * 100}%`, width: `${(over / scale) * 100}%` }}
          />
        )}
      </div>
      <div className={styles.facts}>
        <Caption1 className={styles.numbers}>
          <strong>{formatHours(clocked)}</strong> of {formatHours(book)} book
          {over > 0 && <span className={styles.overText}> · +{formatHours(over)} over</span>}
        </Caption1>
        <Caption1 className={mergeClasses(styles.numbers, late && styles.lateText)}>
          {line.status === 'held'
            ? 'No forecast while held'
            : line.forecast
              ? `${JOB_LINE_STATUS_WORDS.done} ${aboutWords(formatShopTime(line.forecast.finishAt, nowMs, timeZone))}`
              : 'Forecast updating…'}
          {line.promisedAt &&
            (late || line.status === 'held') &&
            ` · promised ${formatShopTime(line.promisedAt, nowMs, timeZone)}`}
        </Caption1>
      </div>
    </>
  );
}
