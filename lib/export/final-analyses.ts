// The preflight's measurements of final pages' pixels: read from the database where an
// instance made them before, otherwise made now in the worker pool and kept (once per
// final page, whichever instance gets there first).
import 'server-only';
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import { analysesOf, keepAnalysis } from '@/db/queries/final-analyses';
import { finalPageRow } from '@/db/queries/final-pages';
import type { ScanAnalysis } from '@/lib/print/scan-analysis';
import { runHeavy } from '@/lib/workers/pool';

/** Measurements under way in this process, by final page: a second ask joins the first (an upload's, a preflight's). */
const running = new Map<string, Promise<ScanAnalysis | null>>();

function measure(db: Kysely<Database>, p: { id: string; keptKey: string }): Promise<ScanAnalysis | null> {
  let job = running.get(p.id);
  if (!job) {
    job = (async () => {
      // Kept meanwhile (by a measurement that finished after the caller looked)? Then that one.
      const kept = (await analysesOf(db, [p.id])).get(p.id);
      if (kept) return kept;
      const a = await runHeavy('analyseFinalPage', { keptKey: p.keptKey });
      if (!a) return null;
      const analysis = { ...a, ink: new Uint8Array(a.ink), colour: new Uint8Array(a.colour) };
      await keepAnalysis(db, p.id, analysis);
      return analysis;
    })().finally(() => running.delete(p.id));
    running.set(p.id, job);
  }
  return job;
}

export async function ensureAnalyses(db: Kysely<Database>, pages: { id: string; keptKey: string }[]): Promise<Map<string, ScanAnalysis>> {
  const known = await analysesOf(
    db,
    pages.map((p) => p.id),
  );
  const missing = pages.filter((p) => !known.has(p.id));
  // A few at a time: the pool queues the rest, and a long book does not fill its queue.
  for (let i = 0; i < missing.length; i += 4) {
    await Promise.all(
      missing.slice(i, i + 4).map(async (p) => {
        const analysis = await measure(db, p);
        if (analysis) known.set(p.id, analysis);
      }),
    );
  }
  return known;
}

/**
 * Starts measuring a new final page in the background, so its preflight is ready when asked for.
 * Nothing waits for it; if this instance goes away first, the first preflight measures it instead.
 */
export function measureSoon(db: Kysely<Database>, finalPageId: string): void {
  void finalPageRow(db, finalPageId)
    .then((row) => (row ? ensureAnalyses(db, [row]) : undefined))
    .catch(() => undefined);
}
