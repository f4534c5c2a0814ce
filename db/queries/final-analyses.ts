// The kept measurements of final pages' pixels, by final page and analysis version.
import type { Kysely } from 'kysely';
import { ANALYSIS_VERSION, type ScanAnalysis } from '@/lib/print/scan-analysis';
import type { Database } from '../database';

export async function analysesOf(db: Kysely<Database>, finalPageIds: string[]): Promise<Map<string, ScanAnalysis>> {
  const out = new Map<string, ScanAnalysis>();
  if (finalPageIds.length === 0) return out;
  const rows = await db
    .selectFrom('finalPageAnalyses')
    .selectAll()
    .where('version', '=', ANALYSIS_VERSION)
    .where('finalPageId', 'in', finalPageIds)
    .execute();
  for (const r of rows) {
    out.set(r.finalPageId, {
      version: r.version,
      width: r.width,
      height: r.height,
      cell: r.cell,
      cols: r.cols,
      rows: r.rows,
      ink: new Uint8Array(r.ink),
      colour: new Uint8Array(r.colour),
      colourPixels: Number(r.colourPixels),
    });
  }
  return out;
}

/** Keeps a measurement; the same one made at once by another instance is kept once. */
export async function keepAnalysis(db: Kysely<Database>, finalPageId: string, a: ScanAnalysis): Promise<void> {
  await db
    .insertInto('finalPageAnalyses')
    .values({
      finalPageId,
      version: a.version,
      width: a.width,
      height: a.height,
      cell: a.cell,
      cols: a.cols,
      rows: a.rows,
      ink: Buffer.from(a.ink),
      colour: Buffer.from(a.colour),
      colourPixels: a.colourPixels,
      createdAt: new Date().toISOString(),
    })
    .onConflict((oc) => oc.columns(['finalPageId', 'version']).doNothing())
    .execute();
}
