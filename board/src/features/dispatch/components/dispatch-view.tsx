import { useCallback, useEffect, useMemo, useState, type ReactNode } from 'react';
import { useMutationState } from '@tanstack/react-query';
import {
  DndContext,
  DragOverlay,
  PointerSensor,
  pointerWithin,
  useSensor,
  useSensors,
  type DragEndEvent,
  type DragOverEvent,
  type DragStartEvent,
} from '@dnd-kit/core';
import {
  Button,
  Caption1,
  MessageBar,
  MessageBarActions,
  MessageBarBody,
  Spinner,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { JOB_LINE_STATUS_WORDS, inSentence, type DispatchBoard } from '@baytime/shared';
import { Glyph } from '@/components/glyph';
import { PageHeader } from '@/components/page-header';
import { formErrorText } from '@/lib/form-errors';
import { useDispatch } from '@/lib/api/get-dispatch';
import { MOVE_LINE_KEY, useMoveLine, type MoveLineVariables } from '../api/patch-job-line';
import { useReleaseBay } from '../api/release-bay';
import {
  dragAnnouncements,
  findLane,
  findLine,
  moveRefusal,
  needsConfirm,
  planMove,
  targetFromDropId,
  type MovePlan,
  type MoveTarget,
} from '../dispatch-model';
import { useMinuteNow } from '@/hooks/use-minute-now';
import { BaysStrip } from './bays-strip';
import { ConfirmMoveDialog } from './confirm-move-dialog';
import { LineCard } from './line-card';
import { LineToolsContext, type LineTools } from './line-tools';
import { QueueColumn } from './queue-column';
import { TechLane } from './tech-lane';

const useStyles = makeStyles({
  root: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalM,
    // The queue and the lanes scroll inside the window, so a drag can reach every lane.
    height: 'calc(100vh - 10rem)',
    minHeight: '30rem',
    '@media (max-width: 900px)': { height: 'auto' },
  },
  notice: {
    position: 'fixed',
    right: tokens.spacingHorizontalXXL,
    bottom: tokens.spacingVerticalXL,
    width: 'min(34rem, calc(100vw - 3rem))',
    zIndex: 10,
    boxShadow: tokens.shadow16,
    borderRadius: tokens.borderRadiusMedium,
    ':empty': { display: 'none' },
  },
  board: {
    flexGrow: 1,
    minHeight: 0,
    display: 'grid',
    gridTemplateColumns: 'minmax(17rem, 23rem) minmax(0, 1fr)',
    gap: tokens.spacingHorizontalM,
    '@media (max-width: 900px)': { gridTemplateColumns: 'minmax(0, 1fr)' },
  },
  queue: { overflowY: 'auto', alignSelf: 'stretch' },
  lanes: {
    overflowY: 'auto',
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(19rem, 1fr))',
    alignContent: 'start',
    alignItems: 'start',
    gap: tokens.spacingHorizontalM,
    paddingRight: tokens.spacingHorizontalXS,
  },
  late: { color: tokens.colorPaletteRedForeground1, fontWeight: tokens.fontWeightSemibold },
  overlay: { width: '20rem' },
  dropWarning: {
    display: 'flex',
    alignItems: 'center',
    gap: tokens.spacingHorizontalXS,
    marginTop: tokens.spacingVerticalXS,
    padding: `${tokens.spacingVerticalXS} ${tokens.spacingHorizontalS}`,
    borderRadius: tokens.borderRadiusMedium,
    backgroundColor: tokens.colorStatusWarningBackground3,
    color: tokens.colorNeutralForegroundOnBrand,
    fontWeight: tokens.fontWeightSemibold,
    boxShadow: tokens.shadow8,
  },
  glyph: { width: '16px', height: '16px', flexShrink: 0 },
});

type Notice = { intent: 'success' | 'warning' | 'error'; text: string };

export interface DispatchViewProps {
  timeZone: string | undefined;
  /** Foreman and owner; an advisor sees the same board without the controls. */
  canEdit: boolean;
  /** Shown at the right of the page title: the live link and the like. */
  headerActions?: ReactNode;
  /** Shown under each line card. */
  lineTools?: LineTools;
}

function Summary({ board, canEdit }: { board: DispatchBoard; canEdit: boolean }) {
  const styles = useStyles();
  return (
    <>
      <strong>{board.queue.length}</strong> {inSentence(JOB_LINE_STATUS_WORDS.queued)} ·{' '}
      <strong>{board.lanes.length}</strong> technicians ·{' '}
      {board.forecastNote ? (
        <span className={styles.late}>{board.forecastNote}</span>
      ) : board.lateCount > 0 ? (
        <span className={styles.late}>{board.lateCount} forecast late</span>
      ) : (
        'nothing forecast late'
      )}
      {canEdit && ' · drag a line to a technician or a bay, or use its Move… menu'}
    </>
  );
}

export function DispatchView({ timeZone, canEdit, headerActions, lineTools }: DispatchViewProps) {
  const dispatch = useDispatch();
  return (
    <>
      <PageHeader
        title="Dispatch"
        description={
          dispatch.data ? (
            <Summary board={dispatch.data} canEdit={canEdit} />
          ) : (
            'Who works on what, and when each line should be done'
          )
        }
        actions={headerActions}
      />
      {dispatch.isPending ? (
        <Spinner label="Loading the dispatch board…" />
      ) : dispatch.isError && !dispatch.data ? (
        <MessageBar intent="error">
          <MessageBarBody>
            {formErrorText(dispatch.error)}{' '}
            <Button size="small" onClick={() => void dispatch.refetch()}>
              Try again
            </Button>
          </MessageBarBody>
        </MessageBar>
      ) : (
        <LineToolsContext.Provider value={lineTools ?? null}>
          <DispatchBoardView board={dispatch.data} timeZone={timeZone} canEdit={canEdit} />
        </LineToolsContext.Provider>
      )}
    </>
  );
}

function DispatchBoardView({
  board,
  timeZone,
  canEdit,
}: {
  board: DispatchBoard;
  timeZone: string | undefined;
  canEdit: boolean;
}) {
  const styles = useStyles();
  const nowMs = useMinuteNow();
  const move = useMoveLine();
  const release = useReleaseBay();
  const [draggingId, setDraggingId] = useState<number | null>(null);
  const [overTarget, setOverTarget] = useState<MoveTarget | null>(null);
  const [confirming, setConfirming] = useState<{ plan: MovePlan; fromMenu: boolean } | null>(null);
  const [notice, setNotice] = useState<Notice | null>(null);
  const [focusLineId, setFocusLineId] = useState<number | null>(null);
  const clearFocus = useCallback(() => setFocusLineId(null), []);

  // Confirmations fade; warnings and errors stay until dismissed or replaced.
  useEffect(() => {
    if (notice?.intent !== 'success') return;
    const timer = setTimeout(() => setNotice(null), 6000);
    return () => clearTimeout(timer);
  }, [notice]);

  const pendingList = useMutationState({
    filters: { mutationKey: MOVE_LINE_KEY, status: 'pending' },
    select: (mutation) => (mutation.state.variables as MoveLineVariables | undefined)?.id,
  });
  const pendingIds = useMemo(
    () => new Set(pendingList.filter((id): id is number => id !== undefined)),
    [pendingList],
  );

  const sensors = useSensors(useSensor(PointerSensor, { activationConstraint: { distance: 6 } }));
  const dragging = draggingId === null ? null : (findLine(board, draggingId) ?? null);
  // Said on the card under the pointer, where the eye is while dragging.
  const dropWarning =
    dragging && overTarget?.kind === 'technician'
      ? (planMove(board, dragging.id, overTarget)?.skillWarning ?? null)
      : null;

  const commit = (plan: MovePlan, fromMenu: boolean) => {
    setConfirming(null);
    setNotice(null);
    if (fromMenu) setFocusLineId(plan.line.id);
    move.mutate(
      { id: plan.line.id, ...plan.patch },
      {
        onSuccess: () =>
          setNotice(
            plan.skillWarning
              ? { intent: 'warning', text: `${plan.summary}. ${plan.skillWarning}.` }
              : { intent: 'success', text: `${plan.summary}.` },
          ),
        onError: (error) => {
          const reason = formErrorText(error).replace(/([^.!?])$/, '$1.');
          setNotice({ intent: 'error', text: `Not moved: ${reason} The line is back where it was.` });
        },
      },
    );
  };

  const request = (lineId: number, target: MoveTarget, fromMenu: boolean) => {
    const plan = planMove(board, lineId, target);
    if (!plan) return;
    const refusal = moveRefusal(plan);
    if (refusal) setNotice({ intent: 'error', text: `Not moved: ${refusal}.` });
    else if (needsConfirm(plan)) setConfirming({ plan, fromMenu });
    else commit(plan, fromMenu);
  };

  const onDragStart = (event: DragStartEvent) => {
    const lineId = (event.active.data.current as { lineId?: number } | undefined)?.lineId;
    setDraggingId(lineId ?? null);
  };
  const onDragOver = (event: DragOverEvent) => setOverTarget(targetFromDropId(event.over?.id));
  const onDragEnd = (event: DragEndEvent) => {
    setDraggingId(null);
    setOverTarget(null);
    const lineId = (event.active.data.current as { lineId?: number } | undefined)?.lineId;
    const target = targetFromDropId(event.over?.id);
    if (lineId !== undefined && target) request(lineId, target, false);
  };

  const onMenuMove = (lineId: number, target: MoveTarget) => request(lineId, target, true);

  const onRelease = (bayId: number) => {
    const bay = board.bays.find((b) => b.id === bayId);
    release.mutate(bayId, {
      onSuccess: () => setNotice({ intent: 'success', text: `${bay?.name ?? 'The bay'} is free.` }),
      onError: (error) => setNotice({ intent: 'error', text: formErrorText(error) }),
    });
  };

  return (
    <DndContext
      sensors={sensors}
      collisionDetection={pointerWithin}
      onDragStart={onDragStart}
      onDragEnd={onDragEnd}
      onDragOver={onDragOver}
      onDragCancel={() => {
        setDraggingId(null);
        setOverTarget(null);
      }}
      accessibility={{
        announcements: dragAnnouncements(board),
        screenReaderInstructions: {
          draggable: 'Use the Move menu on each line to assign it from the keyboard.',
        },
      }}
    >
      <div className={styles.root}>
        <BaysStrip
          board={board}
          canEdit={canEdit}
          dragging={dragging}
          releasingId={release.isPending ? (release.variables ?? null) : null}
          onRelease={onRelease}
        />
        <div className={styles.board}>
          <QueueColumn
            className={styles.queue}
            board={board}
            timeZone={timeZone}
            nowMs={nowMs}
            canEdit={canEdit}
            dragging={dragging}
            pendingIds={pendingIds}
            focusLineId={focusLineId}
            onFocused={clearFocus}
            onMove={onMenuMove}
          />
          <div className={styles.lanes} aria-label="Technicians" role="region">
            {board.lanes.map((lane) => (
              <TechLane
                key={lane.technician.id}
                lane={lane}
                board={board}
                timeZone={timeZone}
                nowMs={nowMs}
                canEdit={canEdit}
                dragging={dragging}
                pendingIds={pendingIds}
                focusLineId={focusLineId}
                onFocused={clearFocus}
                onMove={onMenuMove}
              />
            ))}
            {board.lanes.length === 0 && (
              <Caption1>No active technicians. The owner adds them under Admin, Users.</Caption1>
            )}
          </div>
        </div>
      </div>
      <div className={styles.notice} aria-live="polite">
        {notice && (
          <MessageBar intent={notice.intent} layout="multiline">
            <MessageBarBody>{notice.text}</MessageBarBody>
            <MessageBarActions
              containerAction={
                <Button appearance="transparent" size="small" onClick={() => setNotice(null)}>
                  Dismiss
                </Button>
              }
            />
          </MessageBar>
        )}
      </div>
      <DragOverlay dropAnimation={null}>
        {dragging && (
          <div className={styles.overlay}>
            <LineCard
              line={dragging}
              board={board}
              place={findLane(board, dragging.technicianId) ? 'lane' : 'queue'}
              timeZone={timeZone}
              nowMs={nowMs}
              canEdit={false}
              onMove={() => undefined}
              overlay
            />
            {dropWarning && (
              <div className={styles.dropWarning} role="status">
                <Glyph name="caution" className={styles.glyph} />
                {dropWarning}
              </div>
            )}
          </div>
        )}
      </DragOverlay>
      <ConfirmMoveDialog
        plan={confirming?.plan ?? null}
        onConfirm={(plan) => commit(plan, confirming?.fromMenu ?? false)}
        onCancel={() => setConfirming(null)}
      />
    </DndContext>
  );
}
