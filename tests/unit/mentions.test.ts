import { describe, expect, it } from 'vitest';
import { findMentions, mentionFor, mentionOptions, mentionOutcome, mentionQueryAt, mentionWarning } from '@/lib/review/mentions';

// The demo series' members, and two more who share a first name.
const NELL = { userId: 'u-nell', name: 'Nell Harrow', email: 'owner@quadrille.test' };
const TAM = { userId: 'u-tam', name: 'Tam Quill', email: 'cocreator@quadrille.test' };
const IVO = { userId: 'u-ivo', name: 'Ivo Sand', email: 'editor@quadrille.test' };
const MEMBERS = [NELL, TAM, IVO];
const ROSA_A = { userId: 'u-rosa-a', name: 'Rosa Pike', email: 'rosa.pike@pier.test' };
const ROSA_B = { userId: 'u-rosa-b', name: 'Rosa Dunn', email: 'dunn@pier.test' };

describe('mentions in a comment', () => {
  it('"@Nell" names the member whose first name is Nell (any case); the whole name and the e-mail name work too', () => {
    expect(findMentions('@Nell can you look?', MEMBERS).matched).toEqual([{ mention: '@Nell', userId: 'u-nell', name: 'Nell Harrow' }]);
    expect(findMentions('thanks @nell.', MEMBERS).matched.map((m) => m.mention)).toEqual(['@nell']);
    expect(findMentions('@Nell  Harrow, the turn', MEMBERS).matched).toEqual([{ mention: '@Nell  Harrow', userId: 'u-nell', name: 'Nell Harrow' }]);
    expect(findMentions('@owner and @Tam Quill', MEMBERS).matched.map((m) => m.userId)).toEqual(['u-nell', 'u-tam']);
  });

  it('a mention that names nobody, or several, is said so — never silently dropped', () => {
    const r = findMentions('@Nel and @Rosa and @Ivo', [...MEMBERS, ROSA_A, ROSA_B]);
    expect(r.matched.map((m) => m.userId)).toEqual(['u-ivo']);
    expect(r.unmatched).toEqual(['@Nel']);
    expect(r.ambiguous).toEqual([{ mention: '@Rosa', names: ['Rosa Pike', 'Rosa Dunn'] }]);
    expect(mentionWarning(r)).toBe(
      '@Nel matches nobody in this series; @Rosa matches 2 members (Rosa Pike, Rosa Dunn): write the whole name — no one is told for these.',
    );
    // The whole name settles it.
    expect(findMentions('@Rosa Dunn', [ROSA_A, ROSA_B]).matched.map((m) => m.userId)).toEqual(['u-rosa-b']);
  });

  it('an e-mail address, a lone "@" and a repeated mention are not extra mentions', () => {
    const r = findMentions('mail nell@pier.test or @ me; @Tam, @tam', MEMBERS);
    expect(r).toEqual({ matched: [{ mention: '@Tam', userId: 'u-tam', name: 'Tam Quill' }], unmatched: [], ambiguous: [] });
    expect(mentionWarning(r)).toBeNull();
  });

  it('the picker writes the shortest mention that names exactly that member', () => {
    expect(mentionFor(NELL, MEMBERS)).toBe('@Nell');
    expect(mentionFor(ROSA_A, [ROSA_A, ROSA_B])).toBe('@Rosa Pike');
    // Two members with the very same name: only the e-mail name tells them apart.
    const twin = { userId: 'u-twin', name: 'Rosa Pike', email: 'twin@pier.test' };
    expect(mentionFor(twin, [ROSA_A, twin])).toBe('@twin');
  });

  it('finds the half-typed mention before the caret, and the members it may mean', () => {
    expect(mentionQueryAt('hi @Ne', 6)).toEqual({ start: 3, query: 'Ne' });
    expect(mentionQueryAt('hi @Nell Ha', 11)).toEqual({ start: 3, query: 'Nell Ha' });
    expect(mentionQueryAt('nell@pier', 9)).toBeNull();
    expect(mentionQueryAt('@Nell, then more words and more', 31)).toBeNull();
    expect(mentionOptions('', MEMBERS)).toEqual(MEMBERS);
    expect(mentionOptions('ha', MEMBERS)).toEqual([NELL]); // a word of the name
    expect(mentionOptions('edi', MEMBERS)).toEqual([IVO]); // the e-mail name
  });

  it('after sending, says whom the server told and what matched nobody', () => {
    const mentions = findMentions('@Nell @Tam @Nel', MEMBERS);
    expect(mentionOutcome({ mentions, notified: [{ userId: 'u-tam', name: 'Tam Quill' }] })).toBe(
      'Told by e-mail: Tam Quill. Not e-mailed: Nell Harrow (you, or e-mail notifications off). @Nel matches nobody in this series — no one is told for it.',
    );
    expect(mentionOutcome({ mentions: findMentions('no mention', MEMBERS), notified: [] })).toBeNull();
  });
});
