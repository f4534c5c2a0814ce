import { describe, expect, it } from 'vitest';
import type { Findings, PanelFindings } from '@/lib/review/findings';
import { redFindings } from '@/lib/review/finding-words';

const clean = (panel: number): PanelFindings => ({
  panel,
  inkLoad: 0.1,
  inkHeavy: false,
  roomIntrusions: 0,
  roomIntrusionIds: [],
  outsideSafe: 0,
  outsideSafeIds: [],
  empty: false,
});

describe('the red findings in words, for the question before a "ready to ink" stamp', () => {
  it('says nothing for a pass with no red finding', () => {
    expect(redFindings({ panels: [0, 1, 2, 3].map(clean), beatsMissing: [], inkThreshold: 0.35 })).toEqual([]);
  });

  it('names each red finding, panel by panel, then the beats without a note', () => {
    const f: Findings = {
      panels: [
        { ...clean(0), roomIntrusions: 1, roomIntrusionIds: ['a'] },
        { ...clean(1), inkLoad: 0.414, inkHeavy: true, outsideSafe: 2, outsideSafeIds: ['b', 'c'] },
        clean(2),
        { ...clean(3), inkLoad: 0, empty: true },
      ],
      beatsMissing: ['turn', 'payoff'],
      inkThreshold: 0.35,
    };
    expect(redFindings(f)).toEqual([
      'Panel 1 (Setup): 1 stroke in a balloon room.',
      'Panel 2 (Build): ink load 41 %, over 35 %.',
      'Panel 2 (Build): 2 strokes past the safe area.',
      'Panel 4 (Payoff) is empty.',
      'Beats without a note: Turn, Payoff.',
    ]);
  });
});
