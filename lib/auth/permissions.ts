// Who may do what in a series (PRODUCT.md, "People and roles"). Pure: the
// server guard enforces it, the UI reads it only to hide what a role cannot do.

export const ROLES = ['owner', 'cocreator', 'editor', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  owner: 'Owner',
  cocreator: 'Co-creator',
  editor: 'Editor',
  viewer: 'Viewer',
};

/**
 * One line where a role is chosen. "Editor" is the publishing role, which people used to
 * file sharing read as "can edit"; the hint says what it is.
 */
export const ROLE_HINT =
  'An editor reads, comments and stamps passes “ready to ink” but does not draw; a co-creator draws and edits; a viewer only reads.';

export const ACTIONS = ['read', 'comment', 'edit', 'stamp', 'print', 'manage'] as const;
export type Action = (typeof ACTIONS)[number];

/**
 * - read: see everything in the series
 * - comment: write comments
 * - edit: create and edit gags, beats and passes; reorder
 * - stamp: mark a pass "ready to ink" or "needs another pass"
 * - print: build the print file and the cover file (issue 11: owner, co-creator, editor)
 * - manage: members, volumes, print spec, deleting; asking for a proof while scans are missing
 */
const GRANTS: Record<Action, readonly Role[]> = {
  read: ['owner', 'cocreator', 'editor', 'viewer'],
  comment: ['owner', 'cocreator', 'editor'],
  edit: ['owner', 'cocreator'],
  stamp: ['owner', 'editor'],
  print: ['owner', 'cocreator', 'editor'],
  manage: ['owner'],
};

export function can(role: Role | null | undefined, action: Action): boolean {
  return role != null && GRANTS[action].includes(role);
}

export function permissionsOf(role: Role): Record<Action, boolean> {
  return Object.fromEntries(ACTIONS.map((a) => [a, can(role, a)])) as Record<Action, boolean>;
}
