// Hours left per stage against the deadline (pure). Common practice defaults for
// a small wordless gag page: thumbnails 0.5 h, pencils-inks-tones 1.5 h, scan and
// clean-up 0.25 h per page; all editable per volume. Matter pages (cover, title page,
// afterword…) are pages to make too: every stage until marked done; blank pages need none.
import type { GagStatus } from '@/lib/gags/status';
import type { EntryKind } from '@/lib/print/matter';

export type Stage = 'thumbnails' | 'finish' | 'scan';
export const STAGES: Stage[] = ['thumbnails', 'finish', 'scan'];
export const STAGE_LABELS: Record<Stage, string> = { thumbnails: 'Thumbnails', finish: 'Pencils, inks, tones', scan: 'Scan and clean-up' };
export const DEFAULT_HOURS: Record<Stage, number> = { thumbnails: 0.5, finish: 1.5, scan: 0.25 };

/** Which stages a gag in this status still has ahead of it. */
export function stagesLeft(status: GagStatus): Stage[] {
  switch (status) {
    case 'idea':
    case 'thumbnailing':
    case 'in_review':
      return ['thumbnails', 'finish', 'scan'];
    case 'ready_to_ink':
      return ['finish', 'scan'];
    case 'inked':
      return ['scan'];
    default:
      return [];
  }
}

/** Which stages a matter page still has ahead of it: all of them until it is done; none for a blank page. */
export function matterStagesLeft(kind: EntryKind, done: boolean): Stage[] {
  return done || kind === 'blank' || kind === 'gag' ? [] : [...STAGES];
}

/** A page of the running order: a gag's (by its status) or a matter page (by its kind and whether it is done). */
export type PlanPage = { status: GagStatus } | { matter: EntryKind; done: boolean };

const stagesOf = (p: PlanPage): Stage[] => ('status' in p ? stagesLeft(p.status) : matterStagesLeft(p.matter, p.done));

export type PlanInput = {
  /** The pages in running order. */
  pages: PlanPage[];
  hoursPerPage: Record<Stage, number>;
  hoursPerWeek: number;
  today: Date;
  deadline: Date;
};

export type Plan = {
  hoursByStage: Record<Stage, number>;
  hoursLeft: number;
  weeksNeeded: number;
  finish: string; // YYYY-MM-DD
  marginDays: number;
  late: boolean;
  /** Pages not yet scanned at the start of each week, until done. */
  burndown: { week: number; date: string; pagesLeft: number }[];
};

const DAY = 24 * 3600 * 1000;
const ymd = (d: Date) => d.toISOString().slice(0, 10);

export function plan(input: PlanInput): Plan {
  const hoursByStage: Record<Stage, number> = { thumbnails: 0, finish: 0, scan: 0 };
  const perGag = input.pages.map((p) => stagesOf(p).reduce((h, s) => h + input.hoursPerPage[s], 0));
  for (const p of input.pages) for (const s of stagesOf(p)) hoursByStage[s] += input.hoursPerPage[s];
  const hoursLeft = perGag.reduce((a, b) => a + b, 0);
  const hpw = Math.max(0.1, input.hoursPerWeek);
  const weeksNeeded = hoursLeft / hpw;
  const finishDate = new Date(input.today.getTime() + Math.ceil(weeksNeeded * 7) * DAY);
  const marginDays = Math.floor((input.deadline.getTime() - finishDate.getTime()) / DAY);
  // Work through the pages in running order, a week of hours at a time.
  const burndown: Plan['burndown'] = [];
  let done = 0;
  let acc = 0;
  let left = perGag.filter((h) => h > 0).length;
  for (let week = 0; week <= Math.ceil(weeksNeeded) && week < 520; week++) {
    burndown.push({ week, date: ymd(new Date(input.today.getTime() + week * 7 * DAY)), pagesLeft: left });
    acc += hpw;
    while (done < perGag.length && (perGag[done] === 0 || acc >= perGag[done]! - 1e-9)) {
      if (perGag[done]! > 0) {
        acc -= perGag[done]!;
        left--;
      }
      done++;
    }
  }
  return { hoursByStage, hoursLeft, weeksNeeded, finish: ymd(finishDate), marginDays, late: marginDays < 0, burndown };
}
