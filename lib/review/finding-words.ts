// The findings the gag page shows in the stamp colour, said in words (pure): what a stamp
// "ready to ink" would pass over, for the confirmation before it.
import { BEAT_KINDS, BEAT_LABELS } from '@/lib/gags/status';
import type { Findings } from './findings';

const pct = (n: number) => `${Math.round(n * 100)} %`;
const strokes = (n: number) => `${n} stroke${n === 1 ? '' : 's'}`;

/** One line per red finding, panel by panel, then the beats without a note; empty when none shows. */
export function redFindings(f: Findings): string[] {
  const out: string[] = [];
  for (const p of f.panels) {
    const name = `Panel ${p.panel + 1} (${BEAT_LABELS[BEAT_KINDS[p.panel]!]})`;
    if (p.empty) out.push(`${name} is empty.`);
    if (p.inkHeavy) out.push(`${name}: ink load ${pct(p.inkLoad)}, over ${pct(f.inkThreshold)}.`);
    if (p.roomIntrusions) out.push(`${name}: ${strokes(p.roomIntrusions)} in a balloon room.`);
    if (p.outsideSafe) out.push(`${name}: ${strokes(p.outsideSafe)} past the safe area.`);
  }
  if (f.beatsMissing.length) out.push(`Beats without a note: ${f.beatsMissing.map((k) => BEAT_LABELS[k]).join(', ')}.`);
  return out;
}
