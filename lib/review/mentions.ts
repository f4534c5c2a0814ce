// "@" mentions in a comment, read the same way by the comment form (before sending) and by the
// server (whom to tell), so both say the same thing (pure).
//
// After an "@" that does not sit inside a word (an e-mail address is not a mention) comes either a
// member's whole display name ("@Nell Harrow", any case), or one word that is a member's first name
// or the name part of their e-mail address ("@nell", "@owner"). A whole name wins over a first name;
// a word that names several members is ambiguous and tells no one; one that names nobody, too.

export type MentionMember = { userId: string; name: string; email: string };
export type MentionMatch = { mention: string; userId: string; name: string };
export type Mentions = {
  matched: MentionMatch[];
  /** Mentions that name no member, as written ("@Nel"). */
  unmatched: string[];
  /** Mentions that name more than one member, with those members' names. */
  ambiguous: { mention: string; names: string[] }[];
};

const WORD_CHAR = /[\p{L}\p{N}_'’-]/u;
/** A word after "@": letters, digits, _ ' ’ -, and dots inside it (an e-mail name such as nell.harrow). */
const WORD = /^[\p{L}\p{N}_'’-]+(?:\.[\p{L}\p{N}_'’-]+)*/u;
/** What may stand before an "@" in an address (so "nell@pier.test" is no mention). */
const ADDRESS_CHAR = /[\p{L}\p{N}_.+-]/u;

const fold = (s: string) => s.normalize('NFC').toLowerCase();
export const firstName = (name: string) => name.trim().split(/\s+/)[0] ?? '';
const localPart = (email: string) => email.slice(0, email.lastIndexOf('@'));

/** Whether `text` starts with `name` (any case, runs of spaces as one) and the name ends there. */
function startsWithName(text: string, name: string): number {
  const parts = name.trim().split(/\s+/);
  let at = 0;
  for (const [i, part] of parts.entries()) {
    if (i > 0) {
      const gap = /^[ \t]+/.exec(text.slice(at));
      if (!gap) return 0;
      at += gap[0].length;
    }
    if (fold(text.slice(at, at + part.length)) !== fold(part)) return 0;
    at += part.length;
  }
  return at < text.length && WORD_CHAR.test(text[at]!) ? 0 : at;
}

/** Every mention in `body`, resolved against the series' members. */
export function findMentions(body: string, members: MentionMember[]): Mentions {
  const out: Mentions = { matched: [], unmatched: [], ambiguous: [] };
  for (let i = body.indexOf('@'); i >= 0; i = body.indexOf('@', i + 1)) {
    if (i > 0 && ADDRESS_CHAR.test(body[i - 1]!)) continue;
    const rest = body.slice(i + 1);
    // The longest whole display name that follows.
    let best = 0;
    let whole: MentionMember[] = [];
    for (const m of members) {
      const n = startsWithName(rest, m.name);
      if (n > best) [best, whole] = [n, [m]];
      else if (n > 0 && n === best) whole.push(m);
    }
    let mention: string;
    let found: MentionMember[];
    if (best > 0) {
      mention = `@${rest.slice(0, best)}`;
      found = whole;
    } else {
      const word = WORD.exec(rest)?.[0];
      if (!word) continue;
      mention = `@${word}`;
      found = members.filter((m) => fold(firstName(m.name)) === fold(word) || fold(localPart(m.email)) === fold(word));
    }
    const ids = [...new Set(found.map((m) => m.userId))];
    if (ids.length === 1) {
      const m = found[0]!;
      if (!out.matched.some((x) => x.userId === m.userId)) out.matched.push({ mention, userId: m.userId, name: m.name });
    } else if (ids.length === 0) {
      if (!out.unmatched.includes(mention)) out.unmatched.push(mention);
    } else if (!out.ambiguous.some((a) => a.mention === mention)) {
      out.ambiguous.push({ mention, names: found.map((m) => m.name) });
    }
  }
  return out;
}

/** The shortest mention that names exactly this member: the first name, else the whole name, else the e-mail name. */
export function mentionFor(member: MentionMember, members: MentionMember[]): string {
  const tries = [firstName(member.name), member.name.trim().replace(/\s+/g, ' '), localPart(member.email)];
  for (const t of tries) {
    const r = findMentions(`@${t}`, members);
    if (r.matched.length === 1 && r.matched[0]!.userId === member.userId && r.matched[0]!.mention === `@${t}`) return `@${t}`;
  }
  return `@${member.name}`;
}

/** The mention being typed just before the caret ("@Ne" → "Ne"), or null when the caret is not in one. */
export function mentionQueryAt(text: string, caret: number): { start: number; query: string } | null {
  const before = text.slice(0, caret);
  const at = before.lastIndexOf('@');
  if (at < 0 || (at > 0 && ADDRESS_CHAR.test(before[at - 1]!))) return null;
  const query = before.slice(at + 1);
  // A first name, or a whole name of a few words being typed.
  if (!/^[\p{L}\p{N}_'’.-]*(?: [\p{L}\p{N}_'’.-]*){0,3}$/u.test(query)) return null;
  return { start: at, query };
}

/** The members a half-typed mention may mean: a name, a word of the name or the e-mail name starting with it. */
export function mentionOptions(query: string, members: MentionMember[]): MentionMember[] {
  const q = fold(query.trim());
  if (!q) return members;
  return members.filter(
    (m) => fold(m.name).startsWith(q) || m.name.split(/\s+/).some((w) => fold(w).startsWith(q)) || fold(localPart(m.email)).startsWith(q),
  );
}

/** What the form says about the mentions in a draft, before it is sent; null when there is nothing to warn of. */
export function mentionWarning(m: Mentions): string | null {
  const parts = [
    ...m.unmatched.map((x) => `${x} matches nobody in this series`),
    ...m.ambiguous.map((a) => `${a.mention} matches ${a.names.length} members (${a.names.join(', ')}): write the whole name`),
  ];
  return parts.length ? `${parts.join('; ')} — no one is told for ${parts.length === 1 ? 'it' : 'these'}.` : null;
}

/** What the form says after sending, from the server's answer. */
export function mentionOutcome(answer: { mentions: Mentions; notified: { userId: string; name: string }[] }): string | null {
  const { mentions, notified } = answer;
  if (!mentions.matched.length && !mentions.unmatched.length && !mentions.ambiguous.length) return null;
  const told = notified.length ? `Told by e-mail: ${notified.map((n) => n.name).join(', ')}.` : 'No one was told by e-mail.';
  const quiet = mentions.matched.filter((m) => !notified.some((n) => n.userId === m.userId)).map((m) => m.name);
  const why = quiet.length ? ` Not e-mailed: ${quiet.join(', ')} (you, or e-mail notifications off).` : '';
  const missed = mentionWarning(mentions);
  return `${told}${why}${missed ? ` ${missed}` : ''}`;
}
