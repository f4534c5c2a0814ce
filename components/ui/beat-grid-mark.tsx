import { BEAT_KINDS, BEAT_LABELS, type BeatKind } from '@/lib/gags/status';

/** A tiny 2×2 page: a filled square for each beat that has a note. */
export function BeatGridMark({ beats }: { beats: { kind: BeatKind; note: string }[] }) {
  const written = new Set(beats.filter((b) => b.note.trim() !== '').map((b) => b.kind));
  const label = `${written.size} of 4 beats written${
    written.size
      ? `: ${BEAT_KINDS.filter((k) => written.has(k))
          .map((k) => BEAT_LABELS[k])
          .join(', ')}`
      : ''
  }`;
  return (
    <span className="inline-flex items-center gap-1.5" title={label}>
      <span aria-hidden className="grid grid-cols-2 gap-[2px] rounded-sm border border-marker-40 bg-white p-[2px]">
        {BEAT_KINDS.map((k) => (
          <span key={k} className={`h-2 w-2 ${written.has(k) ? 'bg-graphite' : 'bg-marker-10'}`} />
        ))}
      </span>
      <span className="sr-only">{label}</span>
      <span aria-hidden className="text-xs text-graphite-faint">
        {written.size}/4
      </span>
    </span>
  );
}
