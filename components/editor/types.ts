// What the page gives the editor (a small DTO loaded on the server).
import type { BeatKind } from '@/lib/gags/status';
import type { PageSpec } from '@/lib/print/geometry';
import type { Lightbox, Room, Stroke } from '@/lib/strokes/types';

export type EditorProps = {
  passId: string;
  passNumber: number;
  gagId: string;
  seriesId: string;
  meId: string;
  passes: { id: string; number: number }[];
  canDraw: boolean;
  canComment: boolean;
  canRestore: boolean;
  spec: PageSpec;
  beats: { kind: BeatKind; note: string }[];
  initial: { seq: number; strokes: Stroke[]; rooms: Room[]; lightboxes: Lightbox[] };
};
