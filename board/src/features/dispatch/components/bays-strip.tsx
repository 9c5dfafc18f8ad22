import { useEffect, useState, type ReactNode } from 'react';
import { useRecordFinalCheck } from '../api/final-check';
import { useDroppable } from '@dnd-kit/core';
import { Button, makeStyles, mergeClasses, tokens } from '@fluentui/react-components';
import { BAY_STATE_WORDS, type DispatchBoard, type DispatchLine } from '@baytime/shared';
import { StateChip } from '@/components/state-chip';
import { dropId } from '../dispatch-model';

const useStyles = makeStyles({
  strip: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    columnGap: tokens.spacingHorizontalXS,
    rowGap: tokens.spacingVerticalXS,
  },
  bay: {
    display: 'flex',
    alignItems: 'center',
    gap: tokens.spacingHorizontalXS,
    minHeight: '32px',
    padding: `2px ${tokens.spacingHorizontalXS}`,
    borderRadius: tokens.borderRadiusMedium,
    backgroundColor: tokens.colorNeutralBackground1,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    outline: `${tokens.strokeWidthThick} solid transparent`,
    outlineOffset: '1px',
  },
  name: { fontWeight: tokens.fontWeightBold, whiteSpace: 'nowrap' },
  /**
   * Free bays share one state chip, after their names as on every other chip: a big shop's idle bays
   * would otherwise fill rows of the page.
   */
  free: {
    padding: `2px ${tokens.spacingHorizontalXS}`,
    borderRadius: tokens.borderRadiusMedium,
    backgroundColor: tokens.colorNeutralBackground3,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke1}`,
  },
  target: { outlineColor: tokens.colorNeutralStroke1, outlineStyle: 'dashed' },
  over: {
    outlineStyle: 'solid',
    outlineColor: tokens.colorBrandStroke1,
    backgroundColor: tokens.colorBrandBackground2,
  },
});

function ReleaseButton({ name, busy, onRelease }: { name: string; busy: boolean; onRelease: () => void }) {
  const [confirming, setConfirming] = useState(false);
  useEffect(() => {
    if (!confirming) return;
    const timer = setTimeout(() => setConfirming(false), 5000);
    return () => clearTimeout(timer);
  }, [confirming]);
  return confirming ? (
    <Button
      size="small"
      appearance="primary"
      disabled={busy}
      onClick={() => {
        setConfirming(false);
        onRelease();
      }}
    >
      Vehicle gone: free {name}
    </Button>
  ) : (
    <Button size="small" disabled={busy} onClick={() => setConfirming(true)} aria-label={`Release ${name}`}>
      Release
    </Button>
  );
}

type DispatchBay = DispatchBoard['bays'][number];

/** A bay a line can be dropped on: its name, and whatever the bay's state shows beside it. */
function BayDropTarget({
  bay,
  canEdit,
  dragging,
  children,
}: {
  bay: DispatchBay;
  canEdit: boolean;
  dragging: DispatchLine | null;
  children?: ReactNode;
}) {
  const styles = useStyles();
  const { setNodeRef, isOver } = useDroppable({ id: dropId.bay(bay.id), disabled: !canEdit });
  const incoming = dragging !== null && dragging.bayId !== bay.id;
  return (
    <div
      ref={setNodeRef}
      className={mergeClasses(styles.bay, incoming && styles.target, incoming && isOver && styles.over)}
    >
      <span className={styles.name}>{bay.name}</span>
      {children}
    </div>
  );
}

function BayChip({
  bay,
  canEdit,
  dragging,
  releasing,
  onRelease,
}: {
  bay: DispatchBay;
  canEdit: boolean;
  dragging: DispatchLine | null;
  releasing: boolean;
  onRelease: (bayId: number) => void;
}) {
  const finalCheck = useRecordFinalCheck();
  return (
    <BayDropTarget bay={bay} canEdit={canEdit} dragging={dragging}>
      <StateChip state={bay.state} />
      {bay.state === 'check' && (
        <Button
          size="small"
          disabled={finalCheck.isPending}
          onClick={() => finalCheck.mutate(bay.id)}
          aria-label={`${BAY_STATE_WORDS.check} done in ${bay.name}`}
        >
          {BAY_STATE_WORDS.check} done
        </Button>
      )}
      {canEdit && (bay.state === 'check' || bay.state === 'ready') && (
        <ReleaseButton name={bay.name} busy={releasing} onRelease={() => onRelease(bay.id)} />
      )}
    </BayDropTarget>
  );
}

export interface BaysStripProps {
  board: DispatchBoard;
  canEdit: boolean;
  dragging: DispatchLine | null;
  releasingId: number | null;
  onRelease: (bayId: number) => void;
}

/**
 * Every bay and its state, the bays in use first and then the free ones together; a line dropped on a
 * bay is set to work there.
 */
export function BaysStrip({ board, canEdit, dragging, releasingId, onRelease }: BaysStripProps) {
  const styles = useStyles();
  const free = board.bays.filter((bay) => bay.state === 'free');
  return (
    <section className={styles.strip} aria-label="Bays: drop a line on one to set where it is worked">
      {board.bays
        .filter((bay) => bay.state !== 'free')
        .map((bay) => (
          <BayChip
            key={bay.id}
            bay={bay}
            canEdit={canEdit}
            dragging={dragging}
            releasing={releasingId === bay.id}
            onRelease={onRelease}
          />
        ))}
      {free.length > 0 && (
        <div
          className={mergeClasses(styles.strip, styles.free)}
          role="group"
          aria-label={`Free bays: ${free.length}`}
        >
          {free.map((bay) => (
            <BayDropTarget key={bay.id} bay={bay} canEdit={canEdit} dragging={dragging} />
          ))}
          <StateChip state="free" />
        </div>
      )}
    </section>
  );
}
