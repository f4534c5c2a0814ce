'use client';
// Comments pinned to one beat, shown where the beat is worked on: under its card on the gag
// page and under its note in the editor. Resolved ones are left to the comments panel.
import type { ThreadDto } from '@/db/queries/comments';
import { BEAT_LABELS, type BeatKind } from '@/lib/gags/status';

export function BeatComments({ threads, beat }: { threads: ThreadDto[] | undefined; beat: BeatKind }) {
  const open = (threads ?? []).filter((t) => t.target === 'beat' && t.beat === beat && !t.resolvedAt);
  if (!open.length) return null;
  return (
    <ul className="mt-2 space-y-1 border-t border-paper-edge pt-2 text-sm" aria-label={`Comments on the ${BEAT_LABELS[beat].toLowerCase()} beat`}>
      {open.map((t) => (
        <li key={t.id} data-testid="beat-comment">
          <span className="font-bold">{t.author}:</span> {t.body}
          {t.replies.length > 0 && (
            <span className="text-graphite-faint">
              {' '}
              ({t.replies.length} {t.replies.length === 1 ? 'reply' : 'replies'})
            </span>
          )}
        </li>
      ))}
    </ul>
  );
}
