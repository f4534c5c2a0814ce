// Running-order CSV cells, against OWASP's CSV Injection guidance
// (owasp.org/www-community/attacks/CSV_Injection): cells starting with =, +, -, @,
// tab or carriage return are prefixed with an apostrophe and quoted.
import { describe, expect, it } from 'vitest';
import { csvCell } from '@/lib/export/volume-export';

describe('csvCell', () => {
  it('neutralises cells a spreadsheet would run as formulas', () => {
    expect(csvCell('=HYPERLINK("http://x.test","click")')).toBe(`"'=HYPERLINK(""http://x.test"",""click"")"`);
    expect(csvCell('+1+1')).toBe(`"'+1+1"`);
    expect(csvCell('-2')).toBe(`"'-2"`);
    expect(csvCell('@SUM(A1)')).toBe(`"'@SUM(A1)"`);
    expect(csvCell('\tTab')).toBe(`"'\tTab"`);
    expect(csvCell('\rCR')).toBe(`"'\rCR"`);
  });
  it('leaves plain text and numbers alone, and quotes commas, quotes and newlines (RFC 4180)', () => {
    expect(csvCell('Low Tide Lunch')).toBe('Low Tide Lunch');
    expect(csvCell(12)).toBe('12');
    expect(csvCell('Kettle, again')).toBe('"Kettle, again"');
    expect(csvCell('a "b"')).toBe('"a ""b"""');
    expect(csvCell(null)).toBe('');
  });
});
