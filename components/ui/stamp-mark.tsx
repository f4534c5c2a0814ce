// The mark a stamp leaves on a pass card (the gag page) and a gag card (the board):
// "ready to ink" while it stands, "sent back" for "needs another pass", and a quiet
// note once a "ready" stamp was cleared. Words always say it; colour only repeats it.
// Text marks rather than icons: it shows on the board, whose first load stays light.
import type { StampDecision } from '@/lib/review/words';

export function StampMark({
  decision,
  standing,
  passNumber,
  className = '',
}: {
  decision: StampDecision;
  /** A "ready" stamp that no later change has cleared. */
  standing: boolean;
  /** Said when the mark is not already on that pass's own card. */
  passNumber?: number;
  className?: string;
}) {
  const ofPass = passNumber !== undefined ? ` · pass ${passNumber}` : '';
  if (decision === 'ready' && standing) {
    return (
      <span
        data-testid="stamp-mark"
        data-stamp="ready"
        className={`inline-flex -rotate-2 items-center gap-1 rounded border-2 border-ready bg-ready-light px-1.5 py-0.5 text-xs font-extrabold uppercase tracking-wide text-ready ${className}`}
      >
        <span aria-hidden>✓</span>
        Ready to ink{ofPass}
      </span>
    );
  }
  if (decision === 'again') {
    return (
      <span
        data-testid="stamp-mark"
        data-stamp="again"
        className={`inline-flex items-center gap-1 rounded border border-dashed border-marker-60 bg-marker-10 px-1.5 py-0.5 text-xs font-bold text-graphite-soft ${className}`}
      >
        <span aria-hidden>↩</span>
        Sent back{ofPass}
      </span>
    );
  }
  return (
    <span data-testid="stamp-mark" data-stamp="cleared" className={`inline-flex items-center text-xs text-graphite-faint ${className}`}>
      “Ready” stamp cleared{ofPass}
    </span>
  );
}
