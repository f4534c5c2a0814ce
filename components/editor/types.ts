// What the page gives the editor (a small DTO loaded on the server): the pass's
// identity and spec; its strokes are read by the editor itself (packed).
import type { BeatKind } from '@/lib/gags/status';
import type { PageSpec } from '@/lib/print/geometry';

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
};
