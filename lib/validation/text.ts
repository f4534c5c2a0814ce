// Clean text: the one check every free-text field of the JSON schemas goes through (titles, names, notes,
// comments, ids). Refused: C0 control characters (U+0000–U+001F, NUL included), DEL and the C1 controls
// (U+007F–U+009F), and lone UTF-16 surrogates — half of a pair, which is no character at all and cannot be
// stored as UTF-8 (PostgreSQL also refuses NUL in text). Long texts keep tab and line breaks (OWASP ASVS 4.0.3
// V5.1.4: structured data checked against defined characters).
import { z } from 'zod';

const CONTROLS = /[\u0000-\u001F\u007F-\u009F]/u;
const LAYOUT = new Set(['\t', '\n', '\r']);
// With the u flag a surrogate pair is one code point, so only an unpaired half matches.
const LONE_SURROGATE = /[\uD800-\uDFFF]/u;

const hex = (c: string) => `U+${c.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}`;

/** Why `s` is not clean text, as a sentence about `what`; null when it is. */
export function textProblem(s: string, what: string, opts: { multiline?: boolean } = {}): string | null {
  const surrogate = LONE_SURROGATE.exec(s);
  if (surrogate) return `${what} contains a broken character (an unpaired UTF-16 surrogate, ${hex(surrogate[0])}); type it again.`;
  const control = CONTROLS.exec(s);
  if (!control) return null;
  if (opts.multiline) {
    // Find the first control that is not a tab or a line break.
    for (const c of s) if (CONTROLS.test(c) && !LAYOUT.has(c)) return `${what} contains a control character (${hex(c)}); remove it.`;
    return null;
  }
  if (LAYOUT.has(control[0])) return `${what} is one line: no line breaks or tabs.`;
  return `${what} contains a control character (${hex(control[0])}); remove it.`;
}

const clean =
  (what: string, opts: { multiline?: boolean } = {}) =>
  (s: string, ctx: z.RefinementCtx) => {
    const problem = textProblem(s, what, opts);
    if (problem) ctx.addIssue({ code: 'custom', message: problem });
  };

/** One line of text (a title, a name, an item, an id), trimmed. Chain `.min()` / `.max()` after it. */
export function oneLine(what: string) {
  return z.string().trim().superRefine(clean(what));
}

/** Long text that may hold tabs and line breaks (a comment, a note); trimmed unless `trim: false` (autosaved notes). */
export function longText(what: string, opts: { trim?: boolean } = {}) {
  const base = opts.trim === false ? z.string() : z.string().trim();
  return base.superRefine(clean(what, { multiline: true }));
}
