// The print check of a placed lightbox: how many image pixels land on each
// inch of the printed page. Targets are common practice for print: 300 ppi for
// greyscale (tone) art and 600 ppi for line art. 1 in = 25.4 mm exactly.
import type { Lightbox } from '@/lib/strokes/types';

export const PPI_GREYSCALE = 300;
export const PPI_LINE_ART = 600;

/** Effective resolution of an image of `px` pixels printed `mm` long. */
export function effectivePpi(px: number, mm: number): number {
  return px / (mm / 25.4);
}

/**
 * The lower of the two axes' resolutions of an image placed in a lightbox box.
 * A quarter turn lays the image's height along the box's width.
 */
export function lightboxPpi(l: Pick<Lightbox, 'w' | 'h' | 'rotation'>, image: { width: number; height: number }): number {
  const turned = l.rotation === 90 || l.rotation === 270;
  const alongW = turned ? image.height : image.width;
  const alongH = turned ? image.width : image.height;
  return Math.min(effectivePpi(alongW, l.w), effectivePpi(alongH, l.h));
}

export type PrintCheck = { ppi: number; level: 'line-art' | 'greyscale' | 'low'; message: string };

/** A plain sentence for the editor; rounds before comparing, as the person reads it. */
export function printCheck(ppi: number): PrintCheck {
  const shown = Math.round(ppi);
  if (shown >= PPI_LINE_ART)
    return {
      ppi: shown,
      level: 'line-art',
      message: `${shown} ppi at print size: sharp enough for line art (${PPI_LINE_ART}) and greyscale (${PPI_GREYSCALE}).`,
    };
  if (shown >= PPI_GREYSCALE)
    return {
      ppi: shown,
      level: 'greyscale',
      message: `${shown} ppi at print size: enough for greyscale (${PPI_GREYSCALE}), under the ${PPI_LINE_ART} ppi line art needs.`,
    };
  return {
    ppi: shown,
    level: 'low',
    message: `Only ${shown} ppi at print size: too soft to print. Greyscale needs ${PPI_GREYSCALE} ppi, line art ${PPI_LINE_ART}; use it as a guide to draw over, or rescan.`,
  };
}
