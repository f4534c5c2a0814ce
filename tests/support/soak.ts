// The standing attack suites run short inside `npm test` and long under `npm run soak` (SOAK=1).
// Each suite records its figures here; `tests/soak/run.ts` prints them together at the end.
import fs from 'node:fs';

export const SOAK = process.env.SOAK === '1';

/** The short figure inside `npm test`, the long one in the soak. */
export const scale = (short: number, long: number): number => (SOAK ? long : short);

export type Figures = Record<string, number | string>;

/** Prints one suite's figures and, under the soak runner, appends them to its report (one JSON line each). */
export function recordFigures(suite: string, figures: Figures): void {
  console.log(`[soak] ${suite}: ${JSON.stringify(figures)}`);
  const file = process.env.SOAK_REPORT;
  if (file) fs.appendFileSync(file, JSON.stringify({ suite, figures, at: new Date().toISOString() }) + '\n');
}

/** Nearest-rank percentile (p in 0–1). */
export function percentile(xs: number[], p: number): number {
  if (xs.length === 0) return NaN;
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil(p * s.length) - 1))]!;
}
