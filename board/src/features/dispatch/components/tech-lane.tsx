import { useDroppable } from '@dnd-kit/core';
import {
  Badge,
  Caption1,
  Text,
  makeStyles,
  mergeClasses,
  shorthands,
  tokens,
} from '@fluentui/react-components';
import {
  PERSON_STATUS_WORDS,
  aboutWords,
  skillWords,
  type DispatchBoard,
  type DispatchLane,
  type DispatchLine,
} from '@baytime/shared';
import { Glyph } from '@/components/glyph';
import { dropId, laneLoad, skillWarning, type MoveTarget } from '../dispatch-model';
import { formatBookHours, formatEfficiency, formatShopTime } from '../dispatch-format';
import { LineCard } from './line-card';
import { useColumnStyles } from './column-styles';

const STATUS: Record<
  DispatchLane['technician']['status'],
  { label: string; color: 'brand' | 'important' | 'informative' | 'subtle'; appearance: 'tint' | 'outline' }
> = {
  'on-job': { label: PERSON_STATUS_WORDS['on-job'], color: 'brand', appearance: 'tint' },
  idle: { label: PERSON_STATUS_WORDS.idle, color: 'important', appearance: 'outline' },
  'on-break': { label: PERSON_STATUS_WORDS['on-break'], color: 'informative', appearance: 'tint' },
  off: { label: PERSON_STATUS_WORDS.off, color: 'subtle', appearance: 'tint' },
};

const useStyles = makeStyles({
  off: { opacity: 0.8 },
  name: { fontSize: tokens.fontSizeBase400, fontWeight: tokens.fontWeightBold, flexGrow: 1, minWidth: 0 },
  facts: { display: 'flex', flexWrap: 'wrap', gap: `0 ${tokens.spacingHorizontalM}` },
  late: { color: tokens.colorPaletteRedForeground1, fontWeight: tokens.fontWeightSemibold },
  warn: {
    display: 'flex',
    alignItems: 'center',
    gap: '4px',
    color: tokens.colorStatusWarningForeground1,
    fontWeight: tokens.fontWeightSemibold,
  },
  glyph: { width: '16px', height: '16px', flexShrink: 0 },
  // Idle is told by a dashed outline and its own glyph, in no bay state's colour.
  idle: { ...shorthands.borderStyle('dashed'), ...shorthands.borderWidth(tokens.strokeWidthThick) },
  empty: { color: tokens.colorNeutralForeground3, padding: `${tokens.spacingVerticalS} 0` },
});

export interface TechLaneProps {
  lane: DispatchLane;
  board: DispatchBoard;
  timeZone: string | undefined;
  nowMs: number;
  canEdit: boolean;
  /** The line being dragged, to warn before it is dropped here. */
  dragging: DispatchLine | null;
  pendingIds: ReadonlySet<number>;
  focusLineId: number | null;
  onFocused: () => void;
  onMove: (lineId: number, target: MoveTarget) => void;
}

/** One technician: who, how they are doing, and their lines in the order they will work them. */
export function TechLane({
  lane,
  board,
  timeZone,
  nowMs,
  canEdit,
  dragging,
  pendingIds,
  focusLineId,
  onFocused,
  onMove,
}: TechLaneProps) {
  const styles = useStyles();
  const column = useColumnStyles();
  const { technician } = lane;
  const { setNodeRef, isOver } = useDroppable({ id: dropId.lane(technician.id), disabled: !canEdit });
  const status = STATUS[technician.status];
  const load = laneLoad(lane);
  const late = lane.lines.filter((line) => line.forecast?.late).length;
  const incoming = dragging && dragging.technicianId !== technician.id ? dragging : null;
  const warning = incoming ? skillWarning(incoming, lane) : null;
  const headingId = `lane-${technician.id}`;

  return (
    <section
      ref={setNodeRef}
      aria-labelledby={headingId}
      className={mergeClasses(
        column.column,
        technician.status === 'off' && styles.off,
        !!incoming && column.target,
        !!incoming && isOver && (warning ? column.overWarn : column.over),
      )}
    >
      <header className={column.head}>
        <div className={column.headRow}>
          <Text id={headingId} as="h2" className={styles.name} truncate wrap={false}>
            {technician.name}
          </Text>
          <Badge
            appearance={status.appearance}
            color={status.color}
            className={technician.status === 'idle' ? styles.idle : undefined}
            icon={technician.status === 'idle' ? <Glyph name="idle" className={styles.glyph} /> : undefined}
          >
            {status.label}
          </Badge>
        </div>
        <Caption1 className={styles.facts}>
          <span>{skillWords(technician.skillLevel)}</span>
          <span title="Flagged ÷ clocked hours over the last four weeks">
            {formatEfficiency(lane.efficiency)} efficiency
          </span>
          <span>
            {load.lines} {load.lines === 1 ? 'line' : 'lines'} · {formatBookHours(load.bookHours)}
          </span>
          {lane.finishAt && (
            <span>Available {aboutWords(formatShopTime(lane.finishAt, nowMs, timeZone))}</span>
          )}
          {late > 0 && <span className={styles.late}>{late} late</span>}
        </Caption1>
        {incoming && isOver && warning && (
          <Caption1 className={styles.warn} role="status">
            <Glyph name="caution" className={styles.glyph} />
            {warning}
          </Caption1>
        )}
      </header>
      <div className={column.list}>
        {lane.lines.map((line) => (
          <LineCard
            key={line.id}
            line={line}
            board={board}
            place="lane"
            timeZone={timeZone}
            nowMs={nowMs}
            canEdit={canEdit}
            onMove={onMove}
            pending={pendingIds.has(line.id)}
            focusMenu={focusLineId === line.id}
            onFocused={onFocused}
          />
        ))}
        {lane.lines.length === 0 && (
          <Caption1 className={styles.empty}>Nothing assigned.{canEdit ? ' Drop a line here.' : ''}</Caption1>
        )}
      </div>
    </section>
  );
}
