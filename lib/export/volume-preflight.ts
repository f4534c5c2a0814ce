// The preflight of a volume, page by page in running order, and of the book; and of
// one final page where it stands (for the answer to a fit). The checks themselves are
// pure (lib/print/preflight.ts); this gathers the pages, their current final pages and
// the measurements of their pixels.
import 'server-only';
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import { currentFinalPages, finalPageRow, fitOf } from '@/db/queries/final-pages';
import { pageSpecForGag } from '@/db/queries/series';
import { type EntryDto, findVolume, listEntries } from '@/db/queries/volumes';
import { type BookPreflight, type PagePreflight, bookPreflight, pagePreflight } from '@/lib/print/preflight';
import { PRINTER_FIRST } from '@/lib/print/preflight-rules';
import { ensureAnalyses } from './final-analyses';

export type VolumePreflight = { note: string; pages: PagePreflight[]; book: BookPreflight };
/** One page's checks, with the same caution as the volume's: its figures give way to the printer's. */
export type FinalPagePreflight = PagePreflight & { note: string };

type Row = NonNullable<Awaited<ReturnType<typeof finalPageRow>>>;
const scanOf = (r: Row) => ({ id: r.id, width: r.width, height: r.height, colour: r.colour, fit: fitOf(r) });
const ownerOf = (e: Pick<EntryDto, 'id' | 'gagId'>) => e.gagId ?? e.id;

/** The volume's entries with each page's current final page, if any. */
export async function volumeArt(db: Kysely<Database>, volumeId: string) {
  const volume = (await findVolume(db, volumeId))!;
  const entries = await listEntries(db, volumeId);
  const finals = await currentFinalPages(db, {
    gagIds: entries.flatMap((e) => (e.gagId ? [e.gagId] : [])),
    entryIds: entries.filter((e) => !e.gagId).map((e) => e.id),
  });
  return { volume, entries, finalOf: (e: Pick<EntryDto, 'id' | 'gagId'>) => finals.get(ownerOf(e)) ?? null };
}

export async function volumePreflight(db: Kysely<Database>, volumeId: string): Promise<VolumePreflight> {
  const { volume, entries, finalOf } = await volumeArt(db, volumeId);
  const rows = entries.flatMap((e) => finalOf(e) ?? []);
  const analyses = await ensureAnalyses(db, rows);
  const pages = entries.map((e, i) => {
    const row = finalOf(e);
    return pagePreflight(volume.spec, {
      number: i + 1,
      entryId: e.id,
      ...(e.gagId ? { gagId: e.gagId } : {}),
      kind: e.kind,
      final: row ? scanOf(row) : null,
      analysis: row ? (analyses.get(row.id) ?? null) : null,
    });
  });
  const missing = pages.filter((p) => p.checks.some((c) => c.rule === 'missing' && c.level === 'fail')).map((p) => p.number);
  const book = bookPreflight({ kinds: entries.map((e) => e.kind), binding: volume.spec.binding, caliperUm: volume.spec.caliperUm, missing });
  return { note: PRINTER_FIRST, pages, book };
}

/** One final page's checks on the page it belongs to (its gag's page spec, or its matter page's volume). */
export async function finalPagePreflight(db: Kysely<Database>, finalPageId: string, seriesId: string): Promise<FinalPagePreflight | null> {
  const row = await finalPageRow(db, finalPageId);
  if (!row) return null;
  const placed = await db
    .selectFrom('volumeEntries')
    .select(['id', 'volumeId', 'kind'])
    .where(row.gagId ? 'gagId' : 'id', '=', row.gagId ?? row.entryId!)
    .executeTakeFirst();
  const volume = placed ? await findVolume(db, placed.volumeId) : undefined;
  const spec = row.gagId ? await pageSpecForGag(db, seriesId, row.gagId) : volume!.spec;
  const number = placed ? (await listEntries(db, placed.volumeId)).findIndex((e) => e.id === placed.id) + 1 : 0;
  const analyses = await ensureAnalyses(db, [row]);
  const page = pagePreflight(spec, {
    number,
    entryId: placed?.id ?? '',
    ...(row.gagId ? { gagId: row.gagId } : {}),
    kind: placed?.kind ?? 'gag',
    final: scanOf(row),
    analysis: analyses.get(row.id) ?? null,
  });
  return { ...page, note: PRINTER_FIRST };
}
