// The kinds of page in a volume's running order: a gag, or a page of front or
// back matter. Names as the volume page and the exports show them.

export const MATTER_KINDS = ['cover', 'inside-cover', 'title', 'credits', 'blank', 'afterword', 'inside-back', 'back-cover'] as const;
export const ENTRY_KINDS = ['gag', ...MATTER_KINDS] as const;
export type EntryKind = (typeof ENTRY_KINDS)[number];

export const MATTER_LABELS: Record<EntryKind, string> = {
  gag: 'Gag',
  cover: 'Cover',
  'inside-cover': 'Inside cover',
  title: 'Title page',
  credits: 'Credits',
  blank: 'Blank page',
  afterword: 'Afterword',
  'inside-back': 'Inside back cover',
  'back-cover': 'Back cover',
};

export const entryLabel = (e: { kind: EntryKind; title: string | null }) => (e.kind === 'gag' ? (e.title ?? 'Gag') : MATTER_LABELS[e.kind]);
