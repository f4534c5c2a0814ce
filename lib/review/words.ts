// The review loop's fixed word lists, one place each (as GagStatus and Role are):
// the validation, the database types, the forms and the e-mails all read these.

/** An editor's decision on a pass: "ready to ink", or "needs another pass". */
export const STAMP_DECISIONS = ['ready', 'again'] as const;
export type StampDecision = (typeof STAMP_DECISIONS)[number];

/** What a comment is pinned to. */
export const COMMENT_TARGETS = ['gag', 'pass', 'panel', 'beat', 'point'] as const;
export type CommentTarget = (typeof COMMENT_TARGETS)[number];

/** Where a pinned point sits on the page, in words that read as a position (not as a size). */
export function pointWhere(x: number, y: number): string {
  return `${x.toFixed(1)} mm from the trim’s left edge, ${y.toFixed(1)} mm down from its top`;
}
