// A gag's life: idea → thumbnailing → in review → ready to ink → inked → scanned → placed.
// Pure rules shared by the API (which enforces them) and the UI (which offers only these).

export const GAG_STATUSES = ['idea', 'thumbnailing', 'in_review', 'ready_to_ink', 'inked', 'scanned', 'placed'] as const;
export type GagStatus = (typeof GAG_STATUSES)[number];

export const STATUS_LABELS: Record<GagStatus, string> = {
  idea: 'Idea',
  thumbnailing: 'Thumbnailing',
  in_review: 'In review',
  ready_to_ink: 'Ready to ink',
  inked: 'Inked',
  scanned: 'Scanned',
  placed: 'Placed',
};

export const BEAT_KINDS = ['setup', 'build', 'turn', 'payoff'] as const;
export type BeatKind = (typeof BEAT_KINDS)[number];

export const BEAT_LABELS: Record<BeatKind, string> = {
  setup: 'Setup',
  build: 'Build',
  turn: 'Turn',
  payoff: 'Payoff',
};

/**
 * Status moves a person may make by hand. "Ready to ink" is never among the
 * targets from the drafting side: only an editor's or owner's stamp sets it.
 * From "ready to ink" the gag can go on to "inked", or be pulled back for more
 * thumbnailing; the paper stages step forward or back one at a time.
 */
const MANUAL_MOVES: Record<GagStatus, readonly GagStatus[]> = {
  idea: ['thumbnailing', 'in_review'],
  thumbnailing: ['idea', 'in_review'],
  in_review: ['idea', 'thumbnailing'],
  ready_to_ink: ['in_review', 'thumbnailing', 'inked'],
  inked: ['ready_to_ink', 'scanned'],
  scanned: ['inked', 'placed'],
  placed: ['scanned'],
};

export function allowedManualMoves(from: GagStatus): readonly GagStatus[] {
  return MANUAL_MOVES[from];
}

export type StatusCheck = { ok: true } | { ok: false; reason: string };

/**
 * Whether a person may move a gag by hand. "Ready to ink" always needs a stamp: back
 * from "inked" only while the editor's "ready" stamp still stands (`readyStampStands`).
 */
export function checkManualMove(from: GagStatus, to: GagStatus, ctx: { readyStampStands?: boolean } = {}): StatusCheck {
  if (from === to) return { ok: true };
  if (to === 'ready_to_ink' && !(MANUAL_MOVES[from].includes(to) && ctx.readyStampStands)) {
    return {
      ok: false,
      reason:
        from === 'inked'
          ? 'Back to "ready to ink" only while its stamp stands; this gag\'s was cleared. Ask an editor to stamp a pass.'
          : '"Ready to ink" is set only by an editor\'s or owner\'s stamp on a pass.',
    };
  }
  if (MANUAL_MOVES[from].includes(to)) return { ok: true };
  return {
    ok: false,
    reason: `A gag cannot move from "${STATUS_LABELS[from]}" to "${STATUS_LABELS[to]}". From "${STATUS_LABELS[from]}" it can go to: ${MANUAL_MOVES[from].map((s) => `"${STATUS_LABELS[s]}"`).join(', ')}.`,
  };
}

/**
 * What a cleared "ready to ink" stamp (someone changed the approved pass) does to the gag, in one
 * place for the status and the activity line that reports it:
 * - "ready to ink" goes back to "in review": what was approved is no longer what the pass shows;
 * - "inked", "scanned" and "placed" stay: the page on paper exists whatever the rough does now,
 *   and the line says so rather than claiming the gag is back in review;
 * - the drafting statuses stay as they are.
 */
export function afterStampCleared(status: GagStatus): { status: GagStatus; says: string } {
  if (status === 'ready_to_ink') return { status: 'in_review', says: 'the gag is back in review' };
  if (status === 'inked' || status === 'scanned' || status === 'placed') {
    return { status, says: `the gag stays “${STATUS_LABELS[status]}”: its inked page is not affected` };
  }
  return { status, says: `the gag stays “${STATUS_LABELS[status]}”` };
}

/** What the final art says about a gag: a current final page, fitted by a person, and the gag in a running order. */
export type ArtFacts = { hasFinalPage: boolean; fitted: boolean; inRunningOrder: boolean };

/**
 * The paper stages follow the final art (PRODUCT.md "Gag status"): a gag with a final page is
 * "scanned", and "placed" once that page is fitted and the gag sits in a volume's running order.
 * Without a final page the status is whatever people set. Every change to the art (upload,
 * going back to an earlier scan, a fit, placing in or taking out of a running order) asks this.
 */
export function statusFromArt(current: GagStatus, art: ArtFacts): GagStatus {
  if (!art.hasFinalPage) return current;
  return art.fitted && art.inRunningOrder ? 'placed' : 'scanned';
}

/** A move by hand to "scanned" or "placed" must agree with the art, when the art is known. */
export function checkArtMove(to: GagStatus, art: ArtFacts): StatusCheck {
  if (to === 'scanned' && !art.hasFinalPage) {
    return { ok: false, reason: 'A gag is "scanned" once it has a final page: upload the scan of the inked page.' };
  }
  if (to === 'placed' && !(art.hasFinalPage && art.fitted && art.inRunningOrder)) {
    return {
      ok: false,
      reason: 'A gag is "placed" once its final page is fitted to the page and it sits in a volume\'s running order.',
    };
  }
  return { ok: true };
}
