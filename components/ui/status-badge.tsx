import { STATUS_LABELS, type GagStatus } from '@/lib/gags/status';

// Colour is never the only signal: the label is always written out.
const TONES: Record<GagStatus, string> = {
  idea: 'bg-marker-10 text-graphite-soft border-marker-20',
  thumbnailing: 'bg-white text-graphite border-marker-40',
  in_review: 'bg-ink-light text-ink border-ink/30',
  ready_to_ink: 'bg-ready-light text-ready border-ready/50',
  inked: 'bg-graphite text-white border-graphite',
  // White on marker-80 is about 6.6:1 (WCAG 2.x AA asks 4.5:1 for small text).
  scanned: 'bg-marker-80 text-white border-marker-80',
  placed: 'bg-paper-deep text-graphite border-paper-edge',
};

export function StatusBadge({ status }: { status: GagStatus }) {
  return (
    <span className={`inline-flex items-center rounded-full border px-2 py-0.5 text-xs font-bold ${TONES[status]}`}>
      {status === 'ready_to_ink' && (
        <span aria-hidden className="mr-1">
          ✓
        </span>
      )}
      {STATUS_LABELS[status]}
    </span>
  );
}
