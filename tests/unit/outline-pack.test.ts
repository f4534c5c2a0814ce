// Outlines moved between threads as flat arrays (the editor's outline worker): the path laid from
// the flat arrays is the path laid from the outline itself, point for point (to float32 precision,
// about 1e-5 mm on a 150 mm page), and an outline is only given to the stroke it was computed for.
import { describe, expect, it } from 'vitest';
import { outlineFits, packOutlines, traceFlat, unpackOutlines, type KeptOutline } from '@/components/editor/outline-pack';
import { outlineOf, traceOutline } from '@/lib/strokes/outline';
import type { Stroke } from '@/lib/strokes/types';
import { benchStrokes } from '../bench/strokes-fixture';

type Op = [string, number, number];
function recorder() {
  const ops: Op[] = [];
  return {
    ops,
    moveTo: (x: number, y: number) => ops.push(['M', x, y]),
    lineTo: (x: number, y: number) => ops.push(['L', x, y]),
    closePath: () => ops.push(['Z', 0, 0]),
  };
}

describe('flat outlines', () => {
  const strokes: Stroke[] = [
    ...benchStrokes(30, 7),
    // A dot and a two-point line: the short cases of the outline.
    { id: 'dot', panel: 1, tool: 'pen', grey: 100, size: 1, points: [[40, 40, 0.5]] },
    {
      id: 'line',
      panel: 2,
      tool: 'tone',
      grey: 40,
      size: 2,
      points: [
        [10, 90, 0.5],
        [60, 95, 0.5],
      ],
    },
  ];

  it('trace the same path as the outlines they were packed from', () => {
    const kept = new Map<string, KeptOutline>();
    unpackOutlines(packOutlines(strokes), kept);
    expect([...kept.keys()]).toEqual(strokes.map((s) => s.id));
    for (const s of strokes) {
      const want = recorder();
      traceOutline(want, outlineOf(s));
      const got = recorder();
      traceFlat(got, kept.get(s.id)!);
      expect(got.ops.length).toBe(want.ops.length);
      expect(want.ops.length).toBeGreaterThan(0);
      got.ops.forEach((op, i) => {
        expect(op[0]).toBe(want.ops[i]![0]);
        expect(Math.abs(op[1] - want.ops[i]![1])).toBeLessThan(1e-4);
        expect(Math.abs(op[2] - want.ops[i]![2])).toBeLessThan(1e-4);
      });
    }
  });

  it('fit only the stroke they were computed for: a moved or changed stroke computes its own', () => {
    const kept = new Map<string, KeptOutline>();
    unpackOutlines(packOutlines(strokes), kept);
    const s = strokes[0]!;
    const k = kept.get(s.id)!;
    expect(outlineFits(k, s)).toBe(true);
    const moved = { ...s, points: s.points.map(([x, y, p]) => [x + 2, y, p] as [number, number, number]) };
    expect(outlineFits(k, moved)).toBe(false);
    expect(outlineFits(k, { ...s, points: s.points.slice(0, -1) })).toBe(false);
  });
});
