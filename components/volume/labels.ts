// Names of page kinds, shared by the volume page and the exports.
import type { EntryKind } from '@/db/database';

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
