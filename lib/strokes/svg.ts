// A pass as an SVG document (mm units), for thumbnails rendered on the server.
// Each stroke is its outline from outline.ts, clipped to its panel's rectangle.
import { type PageSpec, type Rect, bleedBox, panelRects, safeBox } from '@/lib/print/geometry';
import { outlineOf, svgPathFromOutline } from './outline';
import { type Room, type Stroke, greyToCss, strokeAlpha } from './types';

export type SvgOptions = {
  /** Show the page out to the bleed (true) or only the trim (false). */
  bleed?: boolean;
  guides?: boolean;
  rooms?: boolean;
  /** Prefix for clip-path ids, unique per document when several SVGs share a page. */
  idPrefix?: string;
  title?: string;
};

const n = (v: number) => Math.round(v * 1000) / 1000;
const rectAttrs = (r: Rect) => `x="${n(r.x)}" y="${n(r.y)}" width="${n(r.w)}" height="${n(r.h)}"`;
const esc = (s: string) => s.replace(/[&<>"]/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;' })[c]!);

export function passToSvg(spec: PageSpec, strokes: Stroke[], rooms: Room[], opts: SvgOptions = {}): string {
  const prefix = (opts.idPrefix ?? 'p').replace(/[^A-Za-z0-9_-]/g, '');
  const box = opts.bleed === false ? { x: 0, y: 0, w: spec.trimW, h: spec.trimH } : bleedBox(spec);
  const panels = panelRects(spec);
  const parts: string[] = [];
  parts.push(
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="${n(box.x)} ${n(box.y)} ${n(box.w)} ${n(box.h)}" role="img"${opts.title ? ` aria-label="${esc(opts.title)}"` : ''}>`,
  );
  parts.push('<defs>');
  panels.forEach((r, i) => parts.push(`<clipPath id="${prefix}-c${i}"><rect ${rectAttrs(r)}/></clipPath>`));
  parts.push('</defs>');
  parts.push(`<rect ${rectAttrs(box)} fill="#fff"/>`);
  panels.forEach((r) => parts.push(`<rect ${rectAttrs(r)} fill="none" stroke="#b4b1aa" stroke-width="0.35"/>`));
  if (opts.rooms !== false) {
    for (const room of rooms) {
      const attrs =
        room.shape === 'ellipse'
          ? `<ellipse cx="${n(room.x + room.w / 2)}" cy="${n(room.y + room.h / 2)}" rx="${n(room.w / 2)}" ry="${n(room.h / 2)}"`
          : `<rect ${rectAttrs(room)} rx="1"`;
      parts.push(
        `${attrs} fill="#dbe8f0" fill-opacity="0.6" stroke="#1d4e6e" stroke-width="0.3" stroke-dasharray="1 0.8" clip-path="url(#${prefix}-c${room.panel})"/>`,
      );
    }
  }
  for (const s of strokes) {
    const d = svgPathFromOutline(outlineOf(s));
    if (!d) continue;
    const alpha = strokeAlpha(s.tool);
    parts.push(`<path d="${d}" fill="${greyToCss(s.grey)}"${alpha < 1 ? ` fill-opacity="${alpha}"` : ''} clip-path="url(#${prefix}-c${s.panel})"/>`);
  }
  if (opts.guides) {
    const safe = safeBox(spec);
    parts.push(`<rect x="0" y="0" width="${n(spec.trimW)}" height="${n(spec.trimH)}" fill="none" stroke="#b8321f" stroke-width="0.25"/>`);
    parts.push(`<rect ${rectAttrs(safe)} fill="none" stroke="#1d4e6e" stroke-width="0.2" stroke-dasharray="1 1"/>`);
  }
  parts.push('</svg>');
  return parts.join('');
}
