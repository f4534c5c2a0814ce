import { describe, expect, it } from 'vitest';
import { GAG_STATUSES, STATUS_LABELS, afterStampCleared } from '@/lib/gags/status';

describe('afterStampCleared', () => {
  it('sends only "ready to ink" back to review; every other status stays, and the words match the status', () => {
    for (const status of GAG_STATUSES) {
      const after = afterStampCleared(status);
      if (status === 'ready_to_ink') {
        expect(after).toEqual({ status: 'in_review', says: 'the gag is back in review' });
      } else {
        expect(after.status).toBe(status);
        expect(after.says).toContain(`stays “${STATUS_LABELS[status]}”`);
        expect(after.says).not.toMatch(/back in review/);
      }
    }
  });
});
