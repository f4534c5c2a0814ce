import { describe, expect, it } from 'vitest';
import { ACTIONS, ROLES, can, permissionsOf } from '@/lib/auth/permissions';

// Expected table transcribed from PRODUCT.md, "People and roles"; `print` from issue 11 (the print file: owner, co-creator, editor).
const EXPECTED = {
  owner: { read: true, comment: true, edit: true, stamp: true, print: true, manage: true },
  cocreator: { read: true, comment: true, edit: true, stamp: false, print: true, manage: false },
  editor: { read: true, comment: true, edit: false, stamp: true, print: true, manage: false },
  viewer: { read: true, comment: false, edit: false, stamp: false, print: false, manage: false },
} as const;

describe('permissions', () => {
  it.each(ROLES)('%s may do exactly what PRODUCT.md says', (role) => {
    expect(permissionsOf(role)).toEqual(EXPECTED[role]);
  });

  it('grants nothing without a role', () => {
    for (const a of ACTIONS) {
      expect(can(null, a)).toBe(false);
      expect(can(undefined, a)).toBe(false);
    }
  });
});
