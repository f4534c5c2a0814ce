'use client';
// The running order: reorder by dragging or with the keyboard (dnd-kit sortable,
// with spoken announcements), add unplaced gags and matter pages, remove pages.
import { DndContext, type DragEndEvent, KeyboardSensor, PointerSensor, closestCenter, useDraggable, useSensor, useSensors } from '@dnd-kit/core';
import { SortableContext, arrayMove, sortableKeyboardCoordinates, useSortable, verticalListSortingStrategy } from '@dnd-kit/sortable';
import { CSS } from '@dnd-kit/utilities';
import { GripVertical, Plus, X } from 'lucide-react';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { StatusBadge } from '@/components/ui/status-badge';
import type { EntryDto } from '@/db/queries/volumes';
import type { GagStatus } from '@/lib/gags/status';
import { messageOf } from '@/lib/http/client';

import { MATTER_KINDS, MATTER_LABELS, entryLabel } from '@/lib/print/matter';
import { runningOrderActions } from '@/hooks/use-volumes';

function Row({ entry, index, canEdit, onRemove }: { entry: EntryDto; index: number; canEdit: boolean; onRemove: () => void }) {
  const { attributes, listeners, setNodeRef, transform, transition, isDragging } = useSortable({ id: entry.id, disabled: !canEdit });
  return (
    <li
      ref={setNodeRef}
      style={{ transform: CSS.Transform.toString(transform), transition }}
      className={`flex items-center gap-2 rounded-md border bg-white px-2 py-1.5 ${isDragging ? 'border-ink shadow-card' : 'border-paper-edge'}`}
      data-testid="running-order-entry"
      data-entry-id={entry.id}
    >
      {canEdit && (
        <button
          type="button"
          className="cursor-grab rounded p-1 text-graphite-faint hover:bg-paper-deep"
          aria-label={`Move page ${index + 1}, ${entryLabel(entry)}`}
          {...attributes}
          {...listeners}
        >
          <GripVertical aria-hidden className="h-4 w-4" />
        </button>
      )}
      <span className="w-8 text-right font-mono text-xs text-graphite-faint">{index + 1}</span>
      <span className={`flex-1 ${entry.kind === 'gag' ? 'font-bold' : 'italic text-graphite-soft'}`}>{entryLabel(entry)}</span>
      {entry.status && <StatusBadge status={entry.status} />}
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
    useSensor(KeyboardSensor, { coordinateGetter: sortableKeyboardCoordinates }),
  );
  const label = (id: string | number) => {
    const i = entries.findIndex((e) => e.id === id);
    if (i >= 0) return `page ${i + 1}, ${entryLabel(entries[i]!)}`;
    const g = unplaced.find((x) => `gag:${x.id}` === id);
    return g ? `the gag ${g.title}` : 'the item';
  };

  const run = async (fn: () => Promise<unknown>) => {
    setError(null);
    try {
      await fn();
    } catch (err) {
      setError(messageOf(err, 'That did not work.'));
    }
    await onChanged();
  };

  const onDragEnd = async ({ active, over }: DragEndEvent) => {
    if (!over) return;
    const activeId = String(active.id);
    if (activeId.startsWith('gag:')) {
      // Dropped from the unplaced list: append, then move next to where it was dropped.
      await run(async () => {
        const e = await order.addGag(activeId.slice(4));
        if (over.id !== 'running-order' && over.id !== e.id) {
          await order.move(e.id, { before: String(over.id) });
        }
      });
      return;
    }
    if (active.id === over.id) return;
    const from = entries.findIndex((e) => e.id === active.id);
    const to = entries.findIndex((e) => e.id === over.id);
    if (from < 0 || to < 0) return;
    const next = arrayMove(entries, from, to);
    await onChanged(next); // show the new order at once
    await run(() => order.move(activeId, to > from ? { after: String(over.id) } : { before: String(over.id) }));
  };

  return (
    <DndContext
      sensors={sensors}
      collisionDetection={closestCenter}
      onDragEnd={(e) => void onDragEnd(e)}
      accessibility={{
        announcements: {
          onDragStart: ({ active }) => `Picked up ${label(active.id)}.`,
          onDragOver: ({ active, over }) =>
            over ? `${label(active.id)} is over ${label(over.id)}.` : `${label(active.id)} is no longer over a page.`,
          onDragEnd: ({ active, over }) => (over ? `${label(active.id)} was dropped at ${label(over.id)}.` : `${label(active.id)} was dropped.`),
          onDragCancel: ({ active }) => `Moving ${label(active.id)} was cancelled.`,
        },
        screenReaderInstructions: {
          draggable: 'To pick up a page, press space or enter. Use the arrow keys to move it, space or enter to drop it, escape to cancel.',
        },
      }}
    >
      <div className="grid gap-4 lg:grid-cols-[2fr_1fr]">
        <section aria-labelledby="order-title" className="space-y-2">
          <h2 id="order-title" className="text-xl font-extrabold">
            Running order <span className="text-sm font-normal text-graphite-faint">({entries.length} pages)</span>
          </h2>
          {error && (
            <p role="alert" className="text-sm text-stamp">
              {error}
            </p>
          )}
          <SortableContext items={entries.map((e) => e.id)} strategy={verticalListSortingStrategy} id="running-order">
            <ol className="space-y-1" aria-label="Running order">
              {entries.map((e, i) => (
                <Row key={e.id} entry={e} index={i} canEdit={canEdit} onRemove={() => void run(() => order.remove(e.id))} />
              ))}
            </ol>
          </SortableContext>
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
