// Geometry of a lightbox: fitting an image into a panel or the page, quarter
// turns and scaling about the centre. Pure, shared by the editor and the tests.
import type { Rect } from '@/lib/print/geometry';
import type { Lightbox, Rotation } from './types';

const r2 = (n: number) => Math.round(n * 100) / 100;

export const turned = (rotation: Rotation) => rotation === 90 || rotation === 270;

/** The image's own width and height, in mm, before its rotation. */
export function unrotatedSize(l: Pick<Lightbox, 'w' | 'h' | 'rotation'>): { w: number; h: number } {
  return turned(l.rotation) ? { w: l.h, h: l.w } : { w: l.w, h: l.h };
}

/** The largest box with the image's proportions (after rotation) inside `area`, centred. */
export function fitInto(area: Rect, image: { width: number; height: number }, rotation: Rotation): Pick<Lightbox, 'x' | 'y' | 'w' | 'h'> {
  const iw = turned(rotation) ? image.height : image.width;
  const ih = turned(rotation) ? image.width : image.height;
  const s = Math.min(area.w / iw, area.h / ih);
  const w = iw * s;
  const h = ih * s;
  return { x: r2(area.x + (area.w - w) / 2), y: r2(area.y + (area.h - h) / 2), w: r2(w), h: r2(h) };
}

/** A quarter turn clockwise about the box's centre: the box's sides swap. */
export function turnQuarter(l: Lightbox): Lightbox {
  const cx = l.x + l.w / 2;
  const cy = l.y + l.h / 2;
  return { ...l, rotation: ((l.rotation + 90) % 360) as Rotation, x: r2(cx - l.h / 2), y: r2(cy - l.w / 2), w: l.h, h: l.w };
}

/** Scales the box about its centre to `width` mm, keeping its proportions. */
export function scaleTo(l: Lightbox, width: number): Lightbox {
  const k = width / l.w;
  const cx = l.x + l.w / 2;
  const cy = l.y + l.h / 2;
  const w = r2(l.w * k);
  const h = r2(l.h * k);
  return { ...l, x: r2(cx - w / 2), y: r2(cy - h / 2), w, h };
}

/** The box moved so its centre is at (cx, cy). */
export function centreAt(l: Lightbox, cx: number, cy: number): Lightbox {
  return { ...l, x: r2(cx - l.w / 2), y: r2(cy - l.h / 2) };
}
