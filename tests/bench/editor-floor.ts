// Runs inside the editor's own page for `npm run bench`: the floor of opening a
// pass — decoding its strokes from the packed bytes (their stored encoding) and
// rastering them into the panel bitmaps, nothing else. Canvas drawing is recorded and
// rastered later, when the bitmap is next needed: one pixel read from each panel makes the
// raster happen inside the measured time (the editor pays it before its first frame too).
import { PanelRasters } from '@/components/editor/panel-rasters';
import type { PageSpec } from '@/lib/print/geometry';
import { PassReader } from '@/lib/strokes/wire';

export async function editorFloor(passId: string, spec: PageSpec, pxPerMm: number): Promise<{ ms: number; strokes: number }> {
  const bytes = new Uint8Array(await (await fetch(`/api/passes/${passId}`, { headers: { accept: 'application/vnd.quadrille.pass' } })).arrayBuffer());
  const t = performance.now();
  const reader = new PassReader();
  const strokes = reader.push(bytes);
  reader.finish();
  const rasters = new PanelRasters(spec);
  rasters.setScale(pxPerMm);
  rasters.redrawAll(strokes.values());
  for (const c of rasters.canvases) c.getContext('2d')?.getImageData(0, 0, 1, 1);
  return { ms: performance.now() - t, strokes: strokes.length };
}
