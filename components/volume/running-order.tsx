'use client';
// The running order: reorder by dragging or with the keyboard (dnd-kit sortable,
// with spoken announcements), drag unplaced gags in (mouse or keyboard), add matter
// pages, remove pages. Where a drop lands is worked out in ./running-order-moves.
import { DndContext, type DragEndEvent, KeyboardSensor, PointerSensor, useDraggable, useDroppable, useSensor, useSensors } from '@dnd-kit/core';
import { SortableContext, arrayMove, useSortable, verticalListSortingStrategy } from '@dnd-kit/sortable';
import { CSS } from '@dnd-kit/utilities';
import { GripVertical, Plus, X } from 'lucide-react';
import { useEffect, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { StatusBadge } from '@/components/ui/status-badge';
import type { EntryDto } from '@/db/queries/volumes';
import type { GagStatus } from '@/lib/gags/status';
import { messageOf } from '@/lib/http/client';

import { MATTER_KINDS, MATTER_LABELS, entryLabel } from '@/lib/print/matter';
import { runningOrderActions } from '@/hooks/use-volumes';
import { END_SLOT, RUNNING_ORDER_ID, isUnplaced, landing, runningOrderCollisions, runningOrderKeys, sayPlace, sayWhat } from './running-order-moves';
import { counted } from '@/lib/counted';

/** A thin ink line above the page a dragged gag would go in front of (a shadow: no change of layout while dragging). */
const INSERT_MARK = 'shadow-[0_-3px_0_0_#1d4e6e]';

function Row({
  entry,
  index,
  canEdit,
  onRemove,
  onDone,
  insertHere,
  focusHandle,
}: {
  entry: EntryDto;
  index: number;
  canEdit: boolean;
  onRemove: () => void;
  /** A matter page marked done or not (the planner counts its hours until it is). */
  onDone: (done: boolean) => void;
  insertHere: boolean;
  /** Just placed from the unplaced list by keyboard: its handle takes the focus. */
  focusHandle: boolean;
}) {
  const { attributes, listeners, setNodeRef, transform, transition, isDragging } = useSortable({ id: entry.id, disabled: !canEdit });
  const handle = useRef<HTMLButtonElement>(null);
  useEffect(() => {
    if (focusHandle) handle.current?.focus();
  }, [focusHandle]);
  return (
    <li
      ref={setNodeRef}
      style={{ transform: CSS.Transform.toString(transform), transition }}
      className={`flex items-center gap-2 rounded-md border bg-white px-2 py-1.5 ${isDragging ? 'border-ink shadow-card' : 'border-paper-edge'} ${insertHere ? INSERT_MARK : ''}`}
      data-testid="running-order-entry"
      data-entry-id={entry.id}
    >
      {canEdit && (
        <button
          ref={handle}
          type="button"
          className="cursor-grab rounded p-1 text-graphite-faint hover:bg-paper-deep"
          aria-label={`Move page ${index + 1}, ${entryLabel(entry)}`}
          {...attributes}
          {...listeners}
        >
          <GripVertical aria-hidden className="h-4 w-4" />
        </button>
      )}
      <span className="w-8 text-right font-mono text-xs text-graphite-soft">{index + 1}</span>
      <span className={`flex-1 ${entry.kind === 'gag' ? 'font-bold' : 'italic text-graphite-soft'}`}>{entryLabel(entry)}</span>
      {entry.status && <StatusBadge status={entry.status} />}
      {entry.kind !== 'gag' &&
        entry.kind !== 'blank' &&
        (canEdit ? (
          <label className="inline-flex items-center gap-1 text-xs text-graphite-soft">
            <input
              type="checkbox"
              checked={entry.done}
              onChange={(e) => onDone(e.target.checked)}
              aria-label={`Page ${index + 1}, ${entryLabel(entry)}, done`}
            />
            Done
          </label>
        ) : (
          <span className="text-xs text-graphite-soft">{entry.done ? 'Done' : 'To make'}</span>
        ))}
      {canEdit && (
        <button
          type="button"
          className="rounded p-1 text-graphite-faint hover:bg-paper-deep hover:text-stamp"
          aria-label={`Remove page ${index + 1}, ${entryLabel(entry)}`}
          onClick={onRemove}
        >
          <X aria-hidden className="h-4 w-4" />
        </button>
      )}
    </li>
  );
}

/** The place after the last page, where a gag dropped is added at the end. */
function EndSlot({ canEdit, active }: { canEdit: boolean; active: boolean }) {
  const { setNodeRef } = useDroppable({ id: END_SLOT, disabled: !canEdit });
  if (!canEdit) return null;
  return (
    <div
      ref={setNodeRef}
      aria-hidden
      data-testid="running-order-end"
      className={`rounded-md border border-dashed px-2 py-1.5 text-center text-xs ${active ? `border-ink text-ink ${INSERT_MARK}` : 'border-paper-edge text-graphite-faint'}`}
    >
      Drop a gag here to add it after the last page
    </div>
  );
}

function Unplaced({ gag, onAdd, canEdit }: { gag: { id: string; title: string; status: GagStatus }; onAdd: () => void; canEdit: boolean }) {
  const { attributes, listeners, setNodeRef, transform } = useDraggable({ id: `gag:${gag.id}`, disabled: !canEdit });
  return (
    <li
      ref={setNodeRef}
      style={{ transform: CSS.Translate.toString(transform) }}
      className="flex items-center gap-2 rounded-md border border-dashed border-paper-edge bg-white/70 px-2 py-1.5"
    >
      {canEdit && (
        <span className="cursor-grab text-graphite-faint" {...listeners} {...attributes} aria-label={`Drag ${gag.title} into the volume`}>
          <GripVertical aria-hidden className="h-4 w-4" />
        </span>
      )}
      <span className="flex-1 text-sm">{gag.title}</span>
      <StatusBadge status={gag.status} />
      {canEdit && (
        <Button variant="ghost" onClick={onAdd} aria-label={`Add ${gag.title} to the volume`}>
          <Plus aria-hidden className="h-4 w-4" />
        </Button>
      )}
    </li>
  );
}

export function RunningOrder({
  volumeId,
  entries,
  unplaced,
  canEdit,
  onChanged,
}: {
  volumeId: string;
  entries: EntryDto[];
  unplaced: { id: string; title: string; status: GagStatus }[];
  canEdit: boolean;
  onChanged: (next?: EntryDto[]) => Promise<unknown>;
}) {
  const [error, setError] = useState<string | null>(null);
  const [matter, setMatter] = useState<string>('blank');
  const order = runningOrderActions(volumeId);
  const sensors = useSensors(
    useSensor(PointerSensor, { activationConstraint: { distance: 4 } }),
    useSensor(KeyboardSensor, { coordinateGetter: runningOrderKeys }),
  );
  const [dragging, setDragging] = useState<{ active: string; over: string | null } | null>(null);
  const [focusEntry, setFocusEntry] = useState<string | null>(null);
  const what = (id: string | number) => sayWhat(String(id), entries, unplaced);
  const where = (active: string | number, over: string | number | null | undefined) =>
    landing(String(active), over == null ? null : String(over), entries);

  const run = async (fn: () => Promise<unknown>) => {
    setError(null);
    try {
      await fn();
    } catch (err) {
      setError(messageOf(err, 'That did not work.'));
    }
    await onChanged();
  };

  const setDone = async (entryId: string, done: boolean) => {
    await onChanged(entries.map((x) => (x.id === entryId ? { ...x, done } : x))); // the box shows it at once
    await run(() => order.setDone(entryId, done));
  };

  const onDragEnd = async ({ active, over }: DragEndEvent) => {
    setDragging(null);
    const activeId = String(active.id);
    const to = where(activeId, over?.id);
    if (!to || to.request === 'none') return;
    const request = to.request;
    if (isUnplaced(activeId)) {
      // From the unplaced list: append, then move next to where it was dropped.
      let placed: string | null = null;
      await run(async () => {
        const e = await order.addGag(activeId.slice(4));
        placed = e.id;
        if (request !== 'append') await order.move(e.id, request);
      });
      // The row it was picked from is gone: keep the keyboard on the gag, now a page.
      setFocusEntry(placed);
      return;
    }
    const from = entries.findIndex((e) => e.id === activeId);
    await onChanged(arrayMove(entries, from, to.page - 1)); // show the new order at once
    await run(() => order.move(activeId, request === 'append' ? { after: entries[entries.length - 1]!.id } : request));
  };

  return (
    <DndContext
      sensors={sensors}
      collisionDetection={runningOrderCollisions}
      onDragStart={({ active }) => {
        setFocusEntry(null);
        setDragging({ active: String(active.id), over: null });
      }}
      onDragOver={({ active, over }) => setDragging({ active: String(active.id), over: over ? String(over.id) : null })}
      onDragCancel={() => setDragging(null)}
      onDragEnd={(e) => void onDragEnd(e)}
      accessibility={{
        announcements: {
          onDragStart: ({ active }) => `Picked up: ${what(active.id)}.`,
          onDragOver: ({ active, over }) => {
            const to = where(active.id, over?.id);
            if (!to) return `${what(active.id)} is not over the running order; dropping it now changes nothing.`;
            if (to.request === 'none') return `${what(active.id)} would stay at ${sayPlace(to)}.`;
            return `${what(active.id)} would go to ${sayPlace(to)}.`;
          },
          onDragEnd: ({ active, over }) => {
            const to = where(active.id, over?.id);
            if (!to || to.request === 'none') return `${what(active.id)} was dropped where it was; nothing changed.`;
            return `${what(active.id)} was dropped at ${sayPlace(to)}.`;
          },
          onDragCancel: ({ active }) => `Moving ${what(active.id).replace(/^[A-Z]/, (c) => c.toLowerCase())} was cancelled; nothing changed.`,
        },
        screenReaderInstructions: {
          draggable:
            'To pick up a page or an unplaced gag, press space or enter. The up and down arrow keys move it one place at a time through the running order; space or enter drops it there, escape cancels.',
        },
      }}
    >
      <div className="grid gap-4 lg:grid-cols-[2fr_1fr]">
        <section aria-labelledby="order-title" className="space-y-2">
          <h2 id="order-title" className="text-xl font-extrabold">
            Running order <span className="text-sm font-normal text-graphite-faint">({counted(entries.length, 'page')})</span>
          </h2>
          {error && (
            <p role="alert" className="text-sm text-stamp">
              {error}
            </p>
          )}
          <SortableContext items={entries.map((e) => e.id)} strategy={verticalListSortingStrategy} id={RUNNING_ORDER_ID}>
            <ol className="space-y-1" aria-label="Running order">
              {entries.map((e, i) => (
                <Row
                  key={e.id}
                  entry={e}
                  index={i}
                  canEdit={canEdit}
                  onRemove={() => void run(() => order.remove(e.id))}
                  onDone={(done) => void setDone(e.id, done)}
                  insertHere={!!dragging && isUnplaced(dragging.active) && dragging.over === e.id}
                  focusHandle={focusEntry === e.id}
                />
              ))}
            </ol>
          </SortableContext>
          <EndSlot canEdit={canEdit} active={!!dragging && dragging.over === END_SLOT && dragging.active !== entries[entries.length - 1]?.id} />
          {canEdit && (
            <div className="flex flex-wrap items-end gap-2">
              <label className="text-sm font-bold text-graphite-soft">
                Matter page
                <select className="field mt-1 w-auto py-1.5" value={matter} onChange={(e) => setMatter(e.target.value)}>
                  {MATTER_KINDS.map((k) => (
                    <option key={k} value={k}>
                      {MATTER_LABELS[k]}
                    </option>
                  ))}
                </select>
              </label>
              <Button variant="secondary" onClick={() => void run(() => order.addMatter(matter))}>
                Add page
              </Button>
            </div>
          )}
        </section>
        <section aria-labelledby="unplaced-title" className="space-y-2">
          <h2 id="unplaced-title" className="text-xl font-extrabold">
            Unplaced gags
          </h2>
          {unplaced.length === 0 ? (
            <p className="text-sm text-graphite-faint">Every gag of the series is placed.</p>
          ) : (
            <ul className="space-y-1">
              {unplaced.map((g) => (
                <Unplaced key={g.id} gag={g} canEdit={canEdit} onAdd={() => void run(() => order.addGag(g.id))} />
              ))}
            </ul>
          )}
        </section>
      </div>
    </DndContext>
  );
}
