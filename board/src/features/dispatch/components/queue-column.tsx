import { useDroppable } from '@dnd-kit/core';
import { Caption1, Text, makeStyles, mergeClasses, tokens } from '@fluentui/react-components';
import { JOB_LINE_STATUS_WORDS, type DispatchBoard, type DispatchLine } from '@baytime/shared';
import { dropId, sortQueue, type MoveTarget } from '../dispatch-model';
import { formatBookHours } from '../dispatch-format';
import { LineCard } from './line-card';
import { useColumnStyles } from './column-styles';

const useStyles = makeStyles({
  title: { fontSize: tokens.fontSizeBase400, fontWeight: tokens.fontWeightBold, flexGrow: 1 },
  dim: { color: tokens.colorNeutralForeground3 },
  empty: { color: tokens.colorNeutralForeground3, padding: tokens.spacingVerticalM },
});

export interface QueueColumnProps {
  board: DispatchBoard;
  timeZone: string | undefined;
  nowMs: number;
  canEdit: boolean;
  dragging: DispatchLine | null;
  pendingIds: ReadonlySet<number>;
  focusLineId: number | null;
  onFocused: () => void;
  onMove: (lineId: number, target: MoveTarget) => void;
  className?: string;
}

/** Lines nobody on the floor has, most urgent first; dropping a lane's line here unassigns it. */
export function QueueColumn({
  board,
  timeZone,
  nowMs,
  canEdit,
  dragging,
  pendingIds,
  focusLineId,
  onFocused,
  onMove,
  className,
}: QueueColumnProps) {
  const styles = useStyles();
  const column = useColumnStyles();
  const { setNodeRef, isOver } = useDroppable({ id: dropId.queue, disabled: !canEdit });
  const lines = sortQueue(board.queue);
  const hours = lines.reduce((sum, line) => sum + line.bookHours, 0);
  const incoming = dragging !== null && dragging.technicianId !== null;

  return (
    <section
      ref={setNodeRef}
      aria-labelledby="dispatch-queue"
      className={mergeClasses(
        column.column,
        className,
        incoming && column.target,
        incoming && isOver && column.over,
      )}
    >
      <header className={column.head}>
        <div className={column.headRow}>
          <Text id="dispatch-queue" as="h2" className={styles.title}>
            {JOB_LINE_STATUS_WORDS.queued}
          </Text>
        </div>
        <Caption1 className={styles.dim}>
          {lines.length} {lines.length === 1 ? 'line' : 'lines'} · {formatBookHours(hours)} book · most urgent
          first
        </Caption1>
        {incoming && <Caption1>Drop here to unassign</Caption1>}
      </header>
      <div className={column.list}>
        {lines.map((line) => (
          <LineCard
            key={line.id}
            line={line}
            board={board}
            place="queue"
            timeZone={timeZone}
            nowMs={nowMs}
            canEdit={canEdit}
            onMove={onMove}
            pending={pendingIds.has(line.id)}
            focusMenu={focusLineId === line.id}
            onFocused={onFocused}
          />
        ))}
        {lines.length === 0 && <Caption1 className={styles.empty}>Every line has a technician.</Caption1>}
      </div>
    </section>
  );
}
