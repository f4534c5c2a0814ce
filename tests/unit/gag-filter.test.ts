import { describe, expect, it } from 'vitest';
import { filterGags, matchesSearch, searchHint } from '@/lib/gags/filter';

const gags = [
  { title: 'Lid Umbrella', premise: 'Kettle uses the lid as an umbrella; Mrs Brine wants to share it.', status: 'scanned' as const },
  { title: 'Fog Horn', premise: 'In thick fog, Kettle mistakes the fog horn for Mrs Brine calling.', status: 'in_review' as const },
  { title: 'Café Crab', premise: 'A tiny café on the pier.', status: 'idea' as const },
];

describe('board search', () => {
  it('matches every word in title or premise, ignoring case', () => {
    expect(matchesSearch(gags[0]!, 'UMBRELLA')).toBe(true);
    expect(matchesSearch(gags[0]!, 'brine lid')).toBe(true);
    expect(matchesSearch(gags[0]!, 'brine fog')).toBe(false);
  });
  it('ignores accents both ways', () => {
    expect(matchesSearch(gags[2]!, 'cafe')).toBe(true);
    expect(matchesSearch({ ...gags[1]!, title: 'Fog Horn' }, 'hórn')).toBe(true);
  });
  it('an empty query matches all', () => {
    expect(filterGags(gags, '   ', 'all')).toHaveLength(3);
  });
  it('combines the status filter with the search', () => {
    expect(filterGags(gags, 'brine', 'in_review').map((g) => g.title)).toEqual(['Fog Horn']);
    expect(filterGags(gags, 'brine', 'idea')).toEqual([]);
  });
});

describe('the search box hint', () => {
  it('comes from this series’ own titles, never another series’ examples', () => {
    expect(searchHint([{ title: 'Porch Light' }, { title: 'Candle Date' }])).toBe('e.g. porch, light, candle…');
    expect(searchHint([{ title: 'Sugar Cube' }, { title: 'Fog Horn' }])).toBe('e.g. sugar, cube, fog…');
  });
  it('skips short and repeated words, and says plain words for a series with no gag', () => {
    expect(searchHint([{ title: 'A Big Day' }, { title: 'The Big Nap' }])).toBe('e.g. big, day, the…');
    expect(searchHint([{ title: 'Up' }])).toBe('Words from a title or premise');
    expect(searchHint([])).toBe('Words from a title or premise');
  });
});
