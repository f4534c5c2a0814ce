// Counted nouns: English plural forms by CLDR's rule for English ("one" when the number is
// exactly 1, with no visible fraction), as Intl.PluralRules('en') applies it.
import { describe, expect, it } from 'vitest';
import { counted } from '@/lib/counted';

describe('counted', () => {
  it('one sheet, two sheets, no sheets', () => {
    expect(counted(1, 'sheet')).toBe('1 sheet');
    expect(counted(2, 'sheet')).toBe('2 sheets');
    expect(counted(0, 'page')).toBe('0 pages');
  });
  it('takes an irregular plural, and groups thousands', () => {
    expect(counted(1, 'leaf', 'leaves')).toBe('1 leaf');
    expect(counted(3, 'leaf', 'leaves')).toBe('3 leaves');
    expect(counted(1200, 'stroke')).toBe('1,200 strokes');
    expect(counted(1, 'blank page')).toBe('1 blank page');
  });
});
