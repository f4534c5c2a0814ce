// Gathers a volume's pages for the exports (server side).
import 'server-only';
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import { findGag } from '@/db/queries/gags';
import { approvedPasses } from '@/db/queries/stamps';
import { passState } from '@/db/queries/passes';
import { type EntryDto, type VolumeDto, findVolume, listEntries } from '@/db/queries/volumes';
import type { SheetChoiceGag } from '@/lib/print/sheets';
import { entryLabel } from '@/lib/print/matter';
import { uploadKeys } from '@/db/queries/uploads';
import { getObject } from '@/lib/storage/s3';
import sharp from 'sharp';
import type { SheetGag } from './blue-lines';
import type { ReviewPage, ScanImage } from './pdf';

export async function volumePages(
  db: Kysely<Database>,
  volumeId: string,
  opts: { lightbox?: boolean } = {},
): Promise<{ volume: VolumeDto; entries: EntryDto[]; pages: ReviewPage[] }> {
  const volume = (await findVolume(db, volumeId))!;
  const entries = await listEntries(db, volumeId);
  const pages: ReviewPage[] = [];
  for (const [i, e] of entries.entries()) {
    if (e.kind === 'gag' && e.latestPass) {
      const state = await passState(db, e.latestPass.id);
      pages.push({
        number: i + 1,
        kind: 'gag',
        label: e.title ?? 'Gag',
        strokes: state?.strokes ?? [],
        rooms: state?.rooms ?? [],
        lightboxes: opts.lightbox ? (state?.lightboxes ?? []).filter((l) => l.visible) : [],
      });
    } else {
      pages.push({ number: i + 1, kind: e.kind, label: entryLabel(e) });
    }
  }
  return { volume, entries, pages };
}

/**
 * The gag pages a blue-line export may carry, in running order, and the default choice:
 * the gags whose pass has a standing "ready to ink" stamp.
 */
export async function sheetChoice(db: Kysely<Database>, volumeId: string): Promise<{ gags: SheetChoiceGag[]; defaults: string[] }> {
  const entries = await listEntries(db, volumeId);
  const approved = await approvedPasses(
    db,
    entries.flatMap((e) => (e.gagId ? [e.gagId] : [])),
  );
  const gags: SheetChoiceGag[] = [];
  entries.forEach((e, i) => {
    if (e.kind !== 'gag' || !e.gagId) return;
    const a = approved.get(e.gagId);
    gags.push({
      gagId: e.gagId,
      page: i + 1,
      title: e.title ?? 'Gag',
      status: e.status,
      approved: a ? { passId: a.passId, passNumber: a.passNumber, passSeq: a.passSeq, stampedAt: a.stampedAt, by: a.by } : null,
    });
  });
  return { gags, defaults: gags.filter((g) => g.approved).map((g) => g.gagId) };
}

/** What the sheets of these gags (ids from sheetChoice, kept in running order) carry: notes, and the approved pass's strokes and rooms. */
export async function blueLineGags(db: Kysely<Database>, volumeId: string, gagIds: string[]): Promise<SheetGag[]> {
  const wanted = new Set(gagIds);
  const { gags } = await sheetChoice(db, volumeId);
  const out: SheetGag[] = [];
  for (const g of gags) {
    if (!wanted.has(g.gagId)) continue;
    const gag = await findGag(db, g.gagId);
    const state = g.approved ? await passState(db, g.approved.passId) : undefined;
    out.push({
      page: g.page,
      title: g.title,
      notes: gag?.beats.map((b) => ({ kind: b.kind, note: b.note })) ?? [],
      approved: g.approved && state ? { passNumber: g.approved.passNumber, strokes: state.strokes, rooms: state.rooms } : null,
    });
  }
  return out;
}

/**
 * One CSV cell. Text that a spreadsheet would run as a formula (starting with =, +, -, @,
 * a tab or a carriage return) gets a leading apostrophe and quotes, as OWASP's
 * "CSV Injection" guidance advises; numbers stay numbers.
 */
export const csvCell = (v: unknown) => {
  if (typeof v === 'number') return String(v);
  let s = v === null || v === undefined ? '' : String(v);
  const formula = /^[=+\-@\t\r]/.test(s);
  if (formula) s = `'${s}`;
  return formula || /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
};

/**
 * The running order as a spreadsheet reads it: the header on the first line, then one
 * row a page — nothing else (a note above the header is read as a row of data). The
 * printer's-spec guidance is said beside the export button and in the README.
 */
export function runningOrderCsv(entries: EntryDto[]): string {
  const rows = [
    ['page', 'kind', 'title', 'status', 'gag_id'],
    ...entries.map((e, i) => [i + 1, e.kind, entryLabel(e), e.status ?? '', e.gagId ?? '']),
  ];
  return `${rows.map((r) => r.map(csvCell).join(',')).join('\n')}\n`;
}

/**
 * The working copies of the scans these pages place, as PNG or JPEG for the
 * PDF (WebP is turned into PNG). A scan deleted since is left out.
 */
export async function scanImages(db: Kysely<Database>, pages: ReviewPage[]): Promise<Map<string, ScanImage>> {
  const out = new Map<string, ScanImage>();
  const ids = new Set(pages.flatMap((p) => (p.lightboxes ?? []).map((l) => l.uploadId)));
  for (const id of ids) {
    const keys = await uploadKeys(db, id);
    const obj = keys ? await getObject(keys.workingKey) : null;
    if (!keys || !obj) continue;
    if (keys.mime === 'image/jpeg') out.set(id, { bytes: obj.body, format: 'jpg' });
    else if (keys.mime === 'image/png') out.set(id, { bytes: obj.body, format: 'png' });
    else out.set(id, { bytes: new Uint8Array(await sharp(obj.body).png().toBuffer()), format: 'png' });
  }
  return out;
}
