'use client';
// The silent-read checklist of one pass. A new pass starts with nothing ticked; the ticks of the
// pass before can be carried over as "to re-check" — a mark of its own, shown in words, that goes
// when the item is ticked again on this pass (or is dropped).
import { RotateCcw } from 'lucide-react';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { useChecklist } from '@/hooks/use-review';
import { messageOf } from '@/lib/http/client';

export function ChecklistCard({ passId, canTick, previous }: { passId: string; canTick: boolean; previous?: { id: string; number: number } }) {
  const { data, setTicked, carry } = useChecklist(passId);
  const { data: before } = useChecklist(canTick && previous ? previous.id : null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const items = data ?? [];
  const ticked = items.filter((i) => i.ticked);
  const marked = items.filter((i) => i.recheck);
  const tickedBefore = (before ?? []).filter((i) => i.ticked).length;
  const offer = canTick && previous && data && ticked.length === 0 && marked.length === 0 && tickedBefore > 0;

  const save = async (fn: () => Promise<void>, failed: string) => {
    setError(null);
    setBusy(true);
    try {
      await fn();
    } catch (err) {
      setError(messageOf(err, failed));
    } finally {
      setBusy(false);
    }
  };
  const toggle = (id: string, on: boolean) =>
    save(() => setTicked(items.filter((i) => (i.id === id ? on : i.ticked)).map((i) => i.id)), 'Could not save the tick.');
  const dropMark = (id: string) =>
    save(
      () =>
        setTicked(
          ticked.map((i) => i.id),
          marked.filter((i) => i.id !== id).map((i) => i.id),
        ),
      'Could not drop the mark.',
    );

  return (
    <section className="panel p-4" aria-labelledby={`checklist-${passId}`}>
      <h3 id={`checklist-${passId}`} className="mb-2 text-lg font-extrabold">
        Silent-read checklist
      </h3>
      {error && (
        <p role="alert" className="text-sm text-stamp">
          {error}
        </p>
      )}
      {offer && (
        <div className="mb-3 flex flex-wrap items-center gap-2 rounded-md border border-dashed border-ink/50 bg-ink-light/50 px-3 py-2 text-sm">
          <span className="flex-1">
            Nothing is ticked on this pass yet. Pass {previous.number} had {tickedBefore} of {before!.length} ticked.
          </span>
          <Button variant="secondary" disabled={busy} onClick={() => void save(() => carry(previous.number), 'Could not carry the ticks.')}>
            <RotateCcw aria-hidden className="h-4 w-4" /> Carry them as “to re-check”
          </Button>
        </div>
      )}
      <ul className="space-y-1.5">
        {items.map((i) => (
          <li key={i.id} className={i.recheck ? 'rounded-md border border-dashed border-ink/60 bg-ink-light/40 px-1.5 py-1' : undefined}>
            <label className="flex items-start gap-2 text-sm">
              <input
                type="checkbox"
                className="mt-0.5"
                checked={i.ticked}
                disabled={!canTick || busy}
                onChange={(e) => void toggle(i.id, e.target.checked)}
              />
              <span>
                {i.text}
                {i.ticked && (
                  <span className="block text-xs text-graphite-faint" suppressHydrationWarning>
                    ✓ {i.by}, {i.at ? new Date(i.at).toLocaleString() : ''}
                  </span>
                )}
                {i.recheck && (
                  <span className="block text-xs font-bold text-ink" data-testid="recheck-mark">
                    <RotateCcw aria-hidden className="mr-1 inline h-3 w-3" />
                    To re-check: ticked on pass {i.recheck.fromPass}
                  </span>
                )}
              </span>
            </label>
            {i.recheck && canTick && (
              <button
                type="button"
                className="ml-6 text-xs text-graphite-soft hover:underline"
                disabled={busy}
                aria-label={`Drop the “to re-check” mark on “${i.text}”`}
                onClick={() => void dropMark(i.id)}
              >
                Drop the mark
              </button>
            )}
          </li>
        ))}
      </ul>
      <p className="mt-2 text-xs text-graphite-faint">
        {ticked.length} of {items.length} ticked{marked.length ? ` · ${marked.length} to re-check` : ''}
      </p>
    </section>
  );
}
