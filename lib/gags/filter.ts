// Board search and filters (pure). A search matches when every word of the
// query appears in the title or premise, ignoring case and accents.
import type { GagStatus } from './status';

export type Searchable = { title: string; premise: string; status: GagStatus };

function fold(s: string): string {
  return s
    .normalize('NFD')
    .replace(/\p{Diacritic}/gu, '')
    .toLowerCase();
}

export function matchesSearch(gag: Searchable, query: string): boolean {
  const words = fold(query).split(/\s+/).filter(Boolean);
  if (words.length === 0) return true;
  const hay = fold(`${gag.title} ${gag.premise}`);
  return words.every((w) => hay.includes(w));
}

export function filterGags<T extends Searchable>(gags: T[], query: string, status: GagStatus | 'all'): T[] {
  return gags.filter((g) => (status === 'all' || g.status === status) && matchesSearch(g, query));
}

/**
 * The search box's hint, taken from this series' own gags (words of the first titles on
 * the board, in lower case), so no series shows another's examples; plain words when
 * the series has no gag yet.
 */
export function searchHint(gags: { title: string }[]): string {
  const words: string[] = [];
  for (const g of gags) {
    for (const w of g.title.toLowerCase().split(/[^\p{L}\p{N}'’-]+/u)) {
      if (w.length >= 3 && !words.includes(w)) words.push(w);
      if (words.length === 3) return `e.g. ${words.join(', ')}…`;
    }
  }
  return words.length > 0 ? `e.g. ${words.join(', ')}…` : 'Words from a title or premise';
}
