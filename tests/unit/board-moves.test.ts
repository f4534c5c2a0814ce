// The board's drop rule is the server's (lib/gags/status): the same moves allowed, the
// same reasons given, with the stamp the board's cards know about.
import { describe, expect, it } from 'vitest';
import { columnId, dropCheck, statusOfColumn } from '@/components/board/board-moves';
import { GAG_STATUSES, checkManualMove } from '@/lib/gags/status';

const ready = { passId: 'p', passNumber: 2, decision: 'ready' as const, standing: true };

describe('dropping a card on a column', () => {
  it('"ready to ink" is refused from every drafting column, saying only a stamp sets it', () => {
    for (const from of ['idea', 'thumbnailing', 'in_review'] as const) {
      const r = dropCheck({ status: from, stamp: null }, 'ready_to_ink');
      expect(r).toEqual({ ok: false, reason: '"Ready to ink" is set only by an editor\'s or owner\'s stamp on a pass.' });
    }
  });
  it('an inked gag goes back to "ready to ink" only while its stamp stands', () => {
    expect(dropCheck({ status: 'inked', stamp: ready }, 'ready_to_ink').ok).toBe(true);
    expect(dropCheck({ status: 'inked', stamp: { ...ready, standing: false } }, 'ready_to_ink').ok).toBe(false);
    expect(dropCheck({ status: 'inked', stamp: { ...ready, decision: 'again', standing: false } }, 'ready_to_ink').ok).toBe(false);
  });
  it('agrees with the server’s rule for every pair of columns', () => {
    for (const from of GAG_STATUSES) {
      for (const to of GAG_STATUSES) {
        expect(dropCheck({ status: from, stamp: null }, to)).toEqual(checkManualMove(from, to, { readyStampStands: false }));
        expect(dropCheck({ status: from, stamp: ready }, to)).toEqual(checkManualMove(from, to, { readyStampStands: true }));
      }
    }
  });
  it('names columns by status, and reads them back (nothing else is a column)', () => {
    for (const s of GAG_STATUSES) expect(statusOfColumn(columnId(s))).toBe(s);
    expect(statusOfColumn('status:nope')).toBeNull();
    expect(statusOfColumn('demo-gag-01')).toBeNull();
    expect(statusOfColumn(undefined)).toBeNull();
  });
});
