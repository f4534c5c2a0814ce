'use client';
import { History } from 'lucide-react';
import { useRevisions } from '@/hooks/use-passes';
import { useState } from 'react';
import type { RevisionDto } from '@/db/queries/revisions';
import { messageOf } from '@/lib/http/client';

const REASONS: Record<RevisionDto['reason'], string> = {
  created: 'Pass started',
  copied: 'Copied from an earlier pass',
  pause: 'Before a pause in drawing',
  steady: 'While drawing',
  'before-restore': 'Just before a restore',
  restore: 'Restored',
};

export function RevisionsPanel({ passId, canRestore, onRestored }: { passId: string; canRestore: boolean; onRestored: () => void }) {
  const { data, restore: restoreRevision } = useRevisions(passId);
  const [busy, setBusy] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  async function restore(id: string) {
    setBusy(id);
    setError(null);
    try {
      await restoreRevision(id);
      onRestored();
    } catch (err) {
      setError(messageOf(err, 'Could not restore.'));
    } finally {
      setBusy(null);
    }
  }
  return (
    <section className="panel p-3" aria-labelledby="revisions-title">
      <h2 id="revisions-title" className="mb-2 inline-flex items-center gap-1.5 font-display text-lg font-extrabold">
        <History aria-hidden className="h-4 w-4" /> Revisions
      </h2>
      {error && (
        <p role="alert" className="text-sm text-stamp">
          {error}
        </p>
      )}
      <ul className="max-h-64 space-y-1 overflow-y-auto text-sm">
        {(data ?? []).map((r) => (
          <li key={r.id} className="flex items-center justify-between gap-2 rounded px-1 py-0.5 hover:bg-paper-deep/60">
            <span>
              <span className="font-bold">#{r.seq}</span> {REASONS[r.reason]}
              <span className="block text-xs text-graphite-faint" suppressHydrationWarning>
                {new Date(r.createdAt).toLocaleString()} {r.by ? `· ${r.by}` : ''}
              </span>
            </span>
            {canRestore && (
              <button
                type="button"
                disabled={busy !== null}
                onClick={() => void restore(r.id)}
                className="rounded px-2 py-0.5 text-xs font-bold text-ink hover:underline disabled:opacity-50"
              >
                {busy === r.id ? 'Restoring…' : 'Restore'}
              </button>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}
