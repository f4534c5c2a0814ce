// Gathers a volume's pages for the exports (server side).
import 'server-only';
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import { findGag } from '@/db/queries/gags';
import { passState } from '@/db/queries/passes';
import { type EntryDto, type VolumeDto, findVolume, listEntries } from '@/db/queries/volumes';
import { entryLabel } from '@/components/volume/labels';
import type { ReviewPage } from './pdf';

export async function volumePages(db: Kysely<Database>, volumeId: string): Promise<{ volume: VolumeDto; entries: EntryDto[]; pages: ReviewPage[] }> {
  const volume = (await findVolume(db, volumeId))!;
  const entries = await listEntries(db, volumeId);
  const pages: ReviewPage[] = [];
  for (const [i, e] of entries.entries()) {
    if (e.kind === 'gag' && e.latestPass) {
      const state = await passState(db, e.latestPass.id);
      pages.push({ number: i + 1, kind: 'gag', label: e.title ?? 'Gag', strokes: state?.strokes ?? [], rooms: state?.rooms ?? [] });
    } else {
      pages.push({ number: i + 1, kind: e.kind, label: entryLabel(e) });
    }
  }
  return { volume, entries, pages };
}

export async function gagNotes(db: Kysely<Database>, entries: EntryDto[]) {
  const out = [];
  for (const e of entries) {
    if (!e.gagId) continue;
    const g = await findGag(db, e.gagId);
    if (g) out.push({ title: g.title, notes: g.beats.map((b) => b.note) });
  }
  return out;
}

const csvCell = (v: unknown) => {
  const s = v === null || v === undefined ? '' : String(v);
  return /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
};

export function runningOrderCsv(entries: EntryDto[], note: string): string {
  const rows = [['page', 'kind', 'title', 'status', 'gag_id'], ...entries.map((e, i) => [i + 1, e.kind, entryLabel(e), e.status ?? '', e.gagId ?? ''])];
  return `# ${note}\n${rows.map((r) => r.map(csvCell).join(',')).join('\n')}\n`;
}
