// The packed wire format of a pass: what the reader gets back is exactly what
// the JSON answer carries (the stored stroke read through rowToStroke), however
// the bytes are cut into chunks on the way; damaged or short data is an error.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { rowToStroke } from '@/db/queries/stroke-rows';
import { encodePoints } from '@/lib/strokes/codec';
import { TOOLS } from '@/lib/strokes/types';
import { END, type PassHeader, PassReader, type StrokeRow, encodeHeader, encodeStrokes } from '@/lib/strokes/wire';

const rowArb: fc.Arbitrary<StrokeRow> = fc.record({
  strokeId: fc.string({ minLength: 1, maxLength: 40, unit: 'grapheme' }),
  panel: fc.integer({ min: 0, max: 3 }),
  tool: fc.constantFrom(...TOOLS),
  grey: fc.double({ min: 0, max: 100, noNaN: true }),
  size: fc.double({ min: 0.1, max: 20, noNaN: true }),
  ox: fc.double({ min: -150, max: 150, noNaN: true }),
  oy: fc.double({ min: -150, max: 150, noNaN: true }),
  points: fc
    .array(
      fc.tuple(
        fc.double({ min: -3, max: 153, noNaN: true }),
        fc.double({ min: -3, max: 153, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
      ),
      {
        minLength: 1,
        maxLength: 80,
      },
    )
    .map((pts) => encodePoints(pts)),
});

const header = (n: number): PassHeader => ({
  id: 'pass-1',
  gagId: 'demo-gag-01',
  number: 2,
  seq: 17,
  strokeCount: n,
  rooms: [{ id: 'r1', panel: 1, shape: 'oval', x: 60, y: 12, w: 20, h: 10 } as never],
  lightboxes: [],
});

function wire(rows: StrokeRow[], per = 3): Uint8Array {
  const parts = [encodeHeader(header(rows.length))];
  for (let i = 0; i < rows.length; i += per) parts.push(encodeStrokes(rows.slice(i, i + per)));
  parts.push(END);
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let at = 0;
  for (const p of parts) out.set(p, (at += p.length) - p.length);
  return out;
}

function cutAt(bytes: Uint8Array, cuts: number[]): Uint8Array[] {
  const points = [...new Set(cuts.map((c) => Math.floor(c * bytes.length)))].sort((a, b) => a - b);
  const out: Uint8Array[] = [];
  let from = 0;
  for (const c of [...points, bytes.length]) {
    out.push(bytes.subarray(from, c));
    from = c;
  }
  return out;
}

describe('packed pass wire format', () => {
  it('reads back exactly the strokes and header it was given, however the bytes are chunked', () => {
    fc.assert(
      fc.property(fc.array(rowArb, { maxLength: 12 }), fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { maxLength: 8 }), (rows, cuts) => {
        const reader = new PassReader();
        const got = cutAt(wire(rows), cuts).flatMap((c) => reader.push(c));
        expect(reader.finish()).toEqual(header(rows.length));
        expect(got).toEqual(rows.map((r) => rowToStroke(r, r.ox, r.oy)));
      }),
      { numRuns: 300 },
    );
  });

  it('strokes come out as soon as their bytes are in, before the end', () => {
    const rows = fc.sample(rowArb, { numRuns: 6, seed: 3 });
    const bytes = wire(rows, 2);
    const reader = new PassReader();
    const half = reader.push(bytes.subarray(0, Math.floor(bytes.length / 2)));
    expect(half.length).toBeGreaterThan(0);
    expect(reader.done).toBe(false);
    const rest = reader.push(bytes.subarray(Math.floor(bytes.length / 2)));
    expect(half.length + rest.length).toBe(6);
    expect(reader.done).toBe(true);
  });

  it('cut-short, damaged or foreign data is an error, never a silently shorter pass', () => {
    const rows = fc.sample(rowArb, { numRuns: 4, seed: 5 });
    const bytes = wire(rows);
    const short = new PassReader();
    short.push(bytes.subarray(0, bytes.length - 1));
    expect(() => short.finish()).toThrow(/cut short/);
    expect(() => new PassReader().push(new TextEncoder().encode('{"id":"x"}'))).toThrow(/not a Quadrille pass/);
    const trailing = new Uint8Array(bytes.length + 1);
    trailing.set(bytes);
    expect(() => new PassReader().push(trailing)).toThrow(/after its end/);
  });
});
