import { describe, expect, it } from 'vitest';
import { GAG_STATUSES, allowedManualMoves, checkManualMove } from '@/lib/gags/status';

// The life cycle is PRODUCT.md's "Gag status": idea → thumbnailing → in review →
// ready to ink → inked → scanned → placed; "ready to ink" only by a stamp.
describe('gag status moves', () => {
  it('never offers "ready to ink" from the drafting side', () => {
    for (const from of ['idea', 'thumbnailing', 'in_review'] as const) {
      expect(allowedManualMoves(from)).not.toContain('ready_to_ink');
      const r = checkManualMove(from, 'ready_to_ink');
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.reason).toMatch(/stamp/);
    }
  });

  it('lets the drafting stages move freely among themselves', () => {
    expect(checkManualMove('idea', 'thumbnailing').ok).toBe(true);
    expect(checkManualMove('thumbnailing', 'in_review').ok).toBe(true);
    expect(checkManualMove('in_review', 'idea').ok).toBe(true);
  });

  it('goes back from "inked" to "ready to ink" only while the stamp stands', () => {
    expect(checkManualMove('inked', 'ready_to_ink', { readyStampStands: true }).ok).toBe(true);
    const r = checkManualMove('inked', 'ready_to_ink');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.reason).toMatch(/stamp/);
  });

  it('steps the paper stages one at a time', () => {
    expect(checkManualMove('ready_to_ink', 'inked').ok).toBe(true);
    expect(checkManualMove('inked', 'scanned').ok).toBe(true);
    expect(checkManualMove('scanned', 'placed').ok).toBe(true);
    expect(checkManualMove('idea', 'inked').ok).toBe(false);
    expect(checkManualMove('in_review', 'placed').ok).toBe(false);
    expect(checkManualMove('ready_to_ink', 'scanned').ok).toBe(false);
  });

  it('names the allowed targets when it refuses', () => {
    const r = checkManualMove('idea', 'scanned');
    expect(r).toEqual({ ok: false, reason: expect.stringContaining('"Thumbnailing", "In review"') });
  });

  it('accepts staying put from every status, and every target is a real status', () => {
    for (const s of GAG_STATUSES) {
      expect(checkManualMove(s, s).ok).toBe(true);
      for (const t of allowedManualMoves(s)) expect(GAG_STATUSES).toContain(t);
    }
  });
});
