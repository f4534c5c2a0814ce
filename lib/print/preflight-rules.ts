// The preflight's rules, each with its name, its figure and where it comes from (pure).
// Figures are common practice unless a source is named; the printer's own specification
// takes precedence over every one of them, and every message that gives a figure says so
// once per page or book (PRINTER_FIRST).
import type { ScanColour as FinalPageColour } from './final-fit';

export type Level = 'ok' | 'warn' | 'fail';
export type Check = { rule: string; level: Level; message: string; source: string };

export const PRINTER_FIRST = "The printer's own specification takes precedence.";

/** Effective resolution a scan needs at its printed size, by kind (common practice for offset and digital print). */
export const PPI_TARGET: Record<FinalPageColour, number> = { line: 600, grey: 300, rgb: 300 };

const KIND_WORDS: Record<FinalPageColour, string> = { line: 'line art', grey: 'greyscale tone', rgb: 'a colour scan (printed as grey)' };

export const SOURCES = {
  resolution: 'Common practice: line art (1-bit or near) at 600 ppi or more, greyscale tone at 300 ppi or more, at the printed size.',
  colour: 'The book is printed in one ink (greyscale); colour is converted to grey (ITU-R BT.601 luma) in the print file.',
  bleed: 'Common practice: art that runs to the edge must reach the bleed box (the PDF BleedBox, ISO 32000-1 §14.11.2).',
  cutBand: 'Trade rule of thumb: nothing important within the safe margin of the trim; the knife may wander by a millimetre or two.',
  missing: 'Every page of the print file needs its final page; a pass stands in only in a proof.',
  pageCount:
    'Common practice: saddle stitching folds sheets of four pages (a multiple of 4); perfect binding glues leaves (an even count). Printers differ.',
  spine: 'Spine width = pages ÷ 2 × paper caliper (printer guides, common practice).',
} as const;

const fmt = (n: number) => String(Math.round(n));

/** Effective resolution along both of the scan's axes against what its kind needs. */
export function resolutionCheck(ppi: { x: number; y: number }, colour: FinalPageColour): Check {
  const target = PPI_TARGET[colour];
  const low = Math.min(ppi.x, ppi.y);
  const figures = Math.round(ppi.x) === Math.round(ppi.y) ? `${fmt(ppi.x)} ppi` : `${fmt(ppi.x)} × ${fmt(ppi.y)} ppi (across × down the scan)`;
  if (Math.round(low) >= target) {
    return {
      rule: 'resolution',
      level: 'ok',
      message: `${figures} at the fitted size: enough for ${KIND_WORDS[colour]} (${target} ppi).`,
      source: SOURCES.resolution,
    };
  }
  return {
    rule: 'resolution',
    level: 'warn',
    message: `Only ${figures} at the fitted size; ${KIND_WORDS[colour]} wants ${target} ppi or more. Rescan at a higher resolution or print it smaller.`,
    source: SOURCES.resolution,
  };
}
