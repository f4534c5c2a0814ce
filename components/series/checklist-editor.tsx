'use client';
// The owner's wording of the silent-read checklist for this series: one item a line.
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { useSeriesChecklist } from '@/hooks/use-series-checklist';
import { messageOf } from '@/lib/http/client';
import { counted } from '@/lib/counted';

export function ChecklistEditor({ seriesId, canEdit }: { seriesId: string; canEdit: boolean }) {
  const { data, save: saveItems } = useSeriesChecklist(seriesId);
  const [rows, setRows] = useState<{ id?: string; text: string }[] | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const items = rows ?? data ?? [];
  const set = (i: number, text: string) => setRows(items.map((r, k) => (k === i ? { ...r, text } : r)));
  const save = async () => {
    setMessage(null);
    try {
      await saveItems(items.filter((r) => r.text.trim()));
      setRows(null);
      setMessage('Checklist saved.');
    } catch (err) {
      setMessage(messageOf(err, 'Could not save the checklist.'));
    }
  };
  return (
    <details className="panel p-4">
      <summary className="cursor-pointer font-bold">Silent-read checklist ({counted((data ?? []).length, 'item')})</summary>
      <ol className="mt-3 space-y-2">
        {items.map((r, i) => (
          <li key={r.id ?? `new-${i}`} className="flex gap-2">
            <input
              className="field py-1 text-sm"
              value={r.text}
              disabled={!canEdit}
              aria-label={`Checklist item ${i + 1}`}
              onChange={(e) => set(i, e.target.value)}
            />
            {canEdit && (
              <Button variant="ghost" onClick={() => setRows(items.filter((_, k) => k !== i))} aria-label={`Remove item ${i + 1}`}>
                ✕
              </Button>
            )}
          </li>
        ))}
      </ol>
      {canEdit && (
        <div className="mt-3 flex gap-2">
          <Button variant="secondary" onClick={() => setRows([...items, { text: '' }])}>
            Add item
          </Button>
          <Button onClick={() => void save()} disabled={rows === null}>
            Save checklist
          </Button>
        </div>
      )}
      <p className="mt-2 text-sm text-graphite-soft" aria-live="polite">
        {message ?? (canEdit ? '' : 'Only the owner changes the checklist.')}
      </p>
    </details>
  );
}
