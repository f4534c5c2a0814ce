import { describe, expect, it } from 'vitest';
import { signUpSchema } from '@/lib/validation/account';
import { createGagSchema, updateGagSchema } from '@/lib/validation/gag';

describe('gag input', () => {
  it('trims the title and defaults the premise', () => {
    expect(createGagSchema.parse({ title: '  Sugar Cube ' })).toEqual({ title: 'Sugar Cube', premise: '' });
  });
  it('refuses an empty title and a multi-line premise', () => {
    expect(createGagSchema.safeParse({ title: '   ' }).success).toBe(false);
    expect(createGagSchema.safeParse({ title: 'A', premise: 'one\ntwo' }).success).toBe(false);
  });
  it('a patch needs at least one field and no unknown ones', () => {
    expect(updateGagSchema.safeParse({}).success).toBe(false);
    expect(updateGagSchema.safeParse({ position: 3 }).success).toBe(false);
    expect(updateGagSchema.safeParse({ premise: '' }).success).toBe(true);
  });
  it('beats: known kinds, each once', () => {
    expect(updateGagSchema.safeParse({ beats: [{ kind: 'punchline', note: 'x' }] }).success).toBe(false);
    expect(
      updateGagSchema.safeParse({
        beats: [
          { kind: 'turn', note: 'a' },
          { kind: 'turn', note: 'b' },
        ],
      }).success,
    ).toBe(false);
    expect(updateGagSchema.safeParse({ beats: [{ kind: 'turn', note: 'The wave.' }] }).success).toBe(true);
  });
  it('status must be one of the seven', () => {
    expect(updateGagSchema.safeParse({ status: 'finished' }).success).toBe(false);
  });
});

describe('sign-up input', () => {
  it('lower-cases the e-mail and asks for 12 characters', () => {
    expect(signUpSchema.parse({ name: 'Kettle', email: ' Kettle@Pier.TEST ', password: '0123456789ab' }).email).toBe('kettle@pier.test');
    expect(signUpSchema.safeParse({ name: 'Kettle', email: 'kettle@pier.test', password: 'short' }).success).toBe(false);
    expect(signUpSchema.safeParse({ name: 'Kettle', email: 'not-an-address', password: '0123456789ab' }).success).toBe(false);
  });
});

describe('dates and points', () => {
  it('a deadline must be a real calendar date', async () => {
    const { createVolumeSchema } = await import('@/lib/validation/volume');
    expect(createVolumeSchema.safeParse({ title: 'Low Tide', deadline: '2027-03-13' }).success).toBe(true);
    // 2027 is not a leap year (Gregorian calendar): no 29 February, let alone a 30th.
    expect(createVolumeSchema.safeParse({ title: 'Low Tide', deadline: '2027-02-29' }).success).toBe(false);
    expect(createVolumeSchema.safeParse({ title: 'Low Tide', deadline: '2027-02-30' }).success).toBe(false);
    expect(createVolumeSchema.safeParse({ title: 'Low Tide', deadline: '2028-02-29' }).success).toBe(true);
  });
  it('a comment point must be a finite position near the page', async () => {
    const { commentCreateSchema } = await import('@/lib/validation/review');
    const at = (x: number) => commentCreateSchema.safeParse({ body: 'Here.', target: 'point', passId: 'p', panel: 0, x, y: 10 }).success;
    expect(at(20)).toBe(true);
    expect(at(1e308)).toBe(false);
    expect(at(-1e308)).toBe(false);
  });
});
