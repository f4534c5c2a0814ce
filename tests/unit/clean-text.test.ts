// Clean text (lib/validation/text.ts): every free-text field of the JSON schemas refuses C0/C1 control
// characters and lone UTF-16 surrogates (OWASP ASVS 4.0.3 V5.1.4); long texts keep tab and line breaks.
import { describe, expect, it } from 'vitest';
import { createGagSchema, updateGagSchema } from '@/lib/validation/gag';
import { commentCreateSchema, stampSchema } from '@/lib/validation/review';
import { createSeriesSchema } from '@/lib/validation/series';
import { longText, oneLine, textProblem } from '@/lib/validation/text';
import { addEntrySchema, createVolumeSchema } from '@/lib/validation/volume';

describe('clean text', () => {
  it('names the control character it found, and the field', () => {
    expect(textProblem('Tea\u0000Party', 'The title')).toBe('The title contains a control character (U+0000); remove it.');
    expect(textProblem('Tea\u007fParty', 'The title')).toMatch(/U\+007F/);
    expect(textProblem('Tea Party', 'The title')).toBeNull();
  });

  it('one-line fields refuse tabs and line breaks; long texts keep them but no other control', () => {
    expect(oneLine('The title').safeParse('Tea\tParty').error?.issues[0]?.message).toBe('The title is one line: no line breaks or tabs.');
    expect(longText('The comment').safeParse('Line one\n\tLine two\r\n').success).toBe(true);
    expect(longText('The comment').safeParse('Line one\u0000').success).toBe(false);
    expect(longText('The comment').safeParse('Bell\u0007').success).toBe(false);
  });

  it('refuses lone UTF-16 surrogates and keeps pairs (emoji)', () => {
    expect(oneLine('The title').safeParse('Crab 🦀').success).toBe(true);
    expect(oneLine('The title').safeParse('Crab \ud83e').success).toBe(false);
    expect(oneLine('The title').safeParse('\udd80 Crab').success).toBe(false);
  });

  it('a line break at the end of a title is trimmed, as before; inside, it is refused', () => {
    expect(createSeriesSchema.parse({ title: 'Kettle Crab\n' }).title).toBe('Kettle Crab');
    expect(createSeriesSchema.safeParse({ title: 'Kettle\nCrab' }).success).toBe(false);
  });

  it('is used by the schemas: titles, premises, beat notes, comments, stamp notes, ids', () => {
    expect(createVolumeSchema.safeParse({ title: 'Low\u0000Tide', deadline: '2027-03-13' }).success).toBe(false);
    // PostgreSQL refuses NUL in text: an id with one must be a 422, not a database error.
    expect(addEntrySchema.safeParse({ gagId: 'demo-gag-01\u0000' }).success).toBe(false);
    expect(createGagSchema.safeParse({ title: 'Tea\u0000Party' }).success).toBe(false);
    expect(createGagSchema.safeParse({ title: 'Tea Party', premise: 'One\u0001line' }).success).toBe(false);
    expect(updateGagSchema.safeParse({ beats: [{ kind: 'turn', note: 'The wave\nbreaks.' }] }).success).toBe(true);
    expect(updateGagSchema.safeParse({ beats: [{ kind: 'turn', note: 'The wave\u0000' }] }).success).toBe(false);
    expect(commentCreateSchema.safeParse({ body: 'Panel 2\nreads late.' }).success).toBe(true);
    expect(commentCreateSchema.safeParse({ body: 'Panel 2 \ud800' }).success).toBe(false);
    expect(stampSchema.safeParse({ decision: 'ready', note: 'ok\u001b[31m' }).success).toBe(false);
  });
});
