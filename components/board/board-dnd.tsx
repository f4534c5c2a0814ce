'use client';
// Moving gags between the board's status columns. Co-creators and owners drag a card
// (mouse, or a long press on touch) or use the keyboard (its grip: space, left/right
// arrows, space), within the moves lib/gags/status allows; a drop the rules refuse —
// "ready to ink" above all, which only a stamp sets — says why and changes nothing.
import {
  DndContext,
  type DragEndEvent,
  DragOverlay,
  KeyboardSensor,
  MouseSensor,
  TouchSensor,
  useDraggable,
  useDroppable,
  useSensor,
  useSensors,
} from '@dnd-kit/core';
import { useLayoutEffect, useState } from 'react';
import type { GagDto } from '@/db/queries/gags';
import { type GagStatus, STATUS_LABELS } from '@/lib/gags/status';
import { CardInHand, Column, ColumnsFrame, GagCard } from './board-cards';
import { columnCollisions, columnId, columnKeys, dropCheck, statusOfColumn } from './board-moves';

/** After a mouse drag the browser still clicks the card's link: swallow that one click. */
function swallowNextClick() {
  const stop = (e: Event) => {
    e.preventDefault();
    e.stopPropagation();
  };
  window.addEventListener('click', stop, { capture: true, once: true });
  setTimeout(() => window.removeEventListener('click', stop, { capture: true }), 50);
}

export function MovableColumns({
  seriesId,
  gags,
  columns,
  onMove,
  onRefused,
  onReady,
}: {
  seriesId: string;
  gags: GagDto[];
  columns: readonly GagStatus[];
  onMove: (gag: GagDto, to: GagStatus) => Promise<void>;
  onRefused: (message: string) => void;
  /** Called once shown, before the browser paints: the still columns it replaces can go. */
  onReady: () => void;
}) {
  useLayoutEffect(() => onReady(), [onReady]);
  const sensors = useSensors(
    useSensor(MouseSensor, { activationConstraint: { distance: 6 } }),
    // A long press: a quick swipe still scrolls the board on a tablet.
    useSensor(TouchSensor, { activationConstraint: { delay: 250, tolerance: 6 } }),
    useSensor(KeyboardSensor, { coordinateGetter: columnKeys }),
  );
  const [dragging, setDragging] = useState<{ gag: GagDto; over: GagStatus | null } | null>(null);
  const gagOf = (id: string | number) => gags.find((g) => g.id === String(id));
  const title = (id: string | number) => `“${gagOf(id)?.title ?? 'the gag'}”`;
  const from = (id: string | number) => STATUS_LABELS[gagOf(id)?.status ?? 'idea'];

  const onDragEnd = async ({ active, over, activatorEvent }: DragEndEvent) => {
    setDragging(null);
    if (!(activatorEvent instanceof KeyboardEvent)) swallowNextClick();
    const gag = gagOf(active.id);
    const to = statusOfColumn(over?.id);
    if (!gag || !to || to === gag.status) return;
    const check = dropCheck(gag, to);
    if (!check.ok) {
      onRefused(`“${gag.title}” stays in ${STATUS_LABELS[gag.status]}: ${check.reason}`);
      return;
    }
    await onMove(gag, to);
  };

  return (
    <DndContext
      sensors={sensors}
      collisionDetection={columnCollisions}
      onDragStart={({ active }) => {
        const gag = gagOf(active.id);
        if (gag) setDragging({ gag, over: gag.status });
      }}
      onDragOver={({ over }) => setDragging((d) => d && { ...d, over: statusOfColumn(over?.id) })}
      onDragCancel={() => setDragging(null)}
      onDragEnd={(e) => void onDragEnd(e)}
      accessibility={{
        announcements: {
          onDragStart: ({ active }) => `Picked up ${title(active.id)}, in ${from(active.id)}.`,
          onDragOver: ({ active, over }) => {
            const gag = gagOf(active.id);
            const to = statusOfColumn(over?.id);
            if (!gag || !to) return `${title(active.id)} is over no column; dropping it now changes nothing.`;
            if (to === gag.status) return `${title(active.id)} is over its own column, ${STATUS_LABELS[to]}.`;
            const check = dropCheck(gag, to);
            return check.ok
              ? `${title(active.id)} would move to ${STATUS_LABELS[to]}.`
              : `${title(active.id)} cannot go to ${STATUS_LABELS[to]}: ${check.reason}`;
          },
          onDragEnd: ({ active, over }) => {
            const gag = gagOf(active.id);
            const to = statusOfColumn(over?.id);
            if (!gag || !to || to === gag.status) return `${title(active.id)} stays in ${from(active.id)}.`;
            const check = dropCheck(gag, to);
            return check.ok
              ? `${title(active.id)} was moved to ${STATUS_LABELS[to]}.`
              : `${title(active.id)} stays in ${from(active.id)}: ${check.reason}`;
          },
          onDragCancel: ({ active }) => `Moving ${title(active.id)} was cancelled; it stays in ${from(active.id)}.`,
        },
        screenReaderInstructions: {
          draggable:
            'To move this gag to another status, press space or enter. The left and right arrow keys choose a column; space or enter drops it there, escape cancels.',
        },
      }}
    >
      <ColumnsFrame>
        {columns.map((s) => {
          const inColumn = gags.filter((g) => g.status === s);
          const check = dragging && s !== dragging.gag.status ? dropCheck(dragging.gag, s) : null;
          return (
            <DropColumn key={s} status={s} count={inColumn.length} check={check} over={dragging?.over === s}>
              {inColumn.map((g) => (
                <li key={g.id}>
                  <MovableCard seriesId={seriesId} gag={g} />
                </li>
              ))}
            </DropColumn>
          );
        })}
      </ColumnsFrame>
      {/* The card in hand, above everything: the columns' own scrolling never clips it. */}
      <DragOverlay dropAnimation={null}>{dragging ? <CardInHand gag={dragging.gag} /> : null}</DragOverlay>
    </DndContext>
  );
}

function DropColumn(props: Omit<React.ComponentProps<typeof Column>, 'attach'>) {
  const { setNodeRef } = useDroppable({ id: columnId(props.status) });
  return <Column {...props} attach={setNodeRef} />;
}

function MovableCard({ seriesId, gag }: { seriesId: string; gag: GagDto }) {
  const { attributes, listeners, setNodeRef, setActivatorNodeRef, isDragging } = useDraggable({ id: gag.id });
  // The mouse and a long touch drag the whole card; the keyboard picks it up by its grip,
  // so Enter on the title still opens the gag.
  const { onKeyDown, ...pointer } = listeners ?? {};
  return (
    <GagCard
      seriesId={seriesId}
      gag={gag}
      attach={setNodeRef}
      attachGrip={setActivatorNodeRef}
      drag={{ pointer, grip: { ...attributes, onKeyDown }, dragging: isDragging }}
    />
  );
}
