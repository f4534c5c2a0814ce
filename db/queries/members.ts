// Members and invitations. An invitation link carries a random token; only its
// SHA-256 is stored. It works once and for 7 days, and only for the account with
// the address it was sent to, unless the owner made it a link anyone may use.
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import type { Kysely, Transaction } from 'kysely';
import type { Role } from '@/lib/auth/permissions';
import type { Database } from '../database';
import { forUpdate, lockRow } from '../dialect';
import { recordActivity } from './activity';
import { endAllSessions } from './sessions';
import { Refused } from '@/lib/refused';

export const INVITATION_DAYS = 7;

export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

export type MemberDto = { userId: string; name: string; email: string; role: Role; since: string };

export async function listMembers(db: Kysely<Database>, seriesId: string): Promise<MemberDto[]> {
  return db
    .selectFrom('memberships as m')
    .innerJoin('users as u', 'u.id', 'm.userId')
    .select(['u.id as userId', 'u.name', 'u.email', 'm.role', 'm.createdAt as since'])
    .where('m.seriesId', '=', seriesId)
    .orderBy('m.createdAt')
    .execute();
}

/** Invitations neither accepted nor withdrawn, newest first; expired ones too (flagged), so they can be sent again. */
export async function listInvitations(db: Kysely<Database>, seriesId: string, now = new Date()) {
  return db
    .selectFrom('invitations as i')
    .innerJoin('users as u', 'u.id', 'i.invitedBy')
    .select(['i.id', 'i.email', 'i.role', 'i.anyoneWithLink', 'i.createdAt', 'i.expiresAt', 'u.name as invitedBy'])
    .where('i.seriesId', '=', seriesId)
    .where('i.acceptedAt', 'is', null)
    .where('i.revokedAt', 'is', null)
    .orderBy('i.createdAt', 'desc')
    .execute()
    .then((rows) => rows.map((r) => ({ ...r, anyoneWithLink: r.anyoneWithLink === 1, expired: Date.parse(r.expiresAt) <= now.getTime() })));
}

/** Why an invitation link no longer works, in words (null while it does). */
export function invitationGone(
  inv: { acceptedAt: string | null; revokedAt: string | null; replacedBy: string | null; expiresAt: string },
  now: number,
) {
  if (inv.acceptedAt) return 'This invitation has already been used.';
  if (inv.replacedBy) return 'This invitation was sent again with a new link: use the one in the latest e-mail.';
  if (inv.revokedAt) return 'This invitation was withdrawn by the series’ owner.';
  if (Date.parse(inv.expiresAt) <= now) return 'This invitation has expired. Ask the owner for a new one.';
  return null;
}

export async function createInvitation(
  db: Kysely<Database>,
  input: { seriesId: string; email: string; role: Role; invitedBy: string; anyoneWithLink?: boolean },
  now = new Date(),
): Promise<{ id: string; token: string; expiresAt: Date }> {
  const already = await db
    .selectFrom('memberships as m')
    .innerJoin('users as u', 'u.id', 'm.userId')
    .select('u.id')
    .where('m.seriesId', '=', input.seriesId)
    .where('u.email', '=', input.email)
    .executeTakeFirst();
  if (already) throw new Refused(409, `${input.email} is already a member of this series.`);
  const token = randomBytes(24).toString('base64url');
  const id = randomUUID();
  const expiresAt = new Date(now.getTime() + INVITATION_DAYS * 24 * 3600 * 1000);
  await db
    .insertInto('invitations')
    .values({
      id,
      tokenHash: hashToken(token),
      seriesId: input.seriesId,
      email: input.email,
      role: input.role,
      invitedBy: input.invitedBy,
      createdAt: now.toISOString(),
      expiresAt: expiresAt.toISOString(),
      acceptedAt: null,
      acceptedBy: null,
      revokedAt: null,
      anyoneWithLink: input.anyoneWithLink ? 1 : 0,
    })
    .execute();
  return { id, token, expiresAt };
}

/** What an invitation link shows before it is accepted; null when unknown. */
export async function invitationByToken(db: Kysely<Database>, token: string) {
  return db
    .selectFrom('invitations as i')
    .innerJoin('series as s', 's.id', 'i.seriesId')
    .innerJoin('users as u', 'u.id', 'i.invitedBy')
    .select([
      'i.id',
      'i.seriesId',
      's.title as seriesTitle',
      'i.email',
      'i.role',
      'i.expiresAt',
      'i.acceptedAt',
      'i.revokedAt',
      'i.replacedBy',
      'i.anyoneWithLink',
      'u.name as invitedBy',
    ])
    .where('i.tokenHash', '=', hashToken(token))
    .executeTakeFirst();
}

/**
 * An address as an invitation shows it to someone it may not be for: enough to recognise one's own, not to learn
 * someone else's — the first letter of the name (two if it is long), the domain's first letter and its ending:
 * `nell@studio.example` → `n•••@s•••.example`.
 */
export function maskEmail(address: string): string {
  const at = address.lastIndexOf('@');
  if (at < 1) return '•••';
  const local = address.slice(0, at).toLowerCase();
  const domain = address.slice(at + 1).toLowerCase();
  const dot = domain.lastIndexOf('.');
  const shownLocal = local.slice(0, local.length > 6 ? 2 : 1);
  const shownDomain = dot > 0 ? `${domain[0]}•••${domain.slice(dot)}` : '•••';
  return `${shownLocal}•••@${shownDomain}`;
}

/** Whether this account may accept: the address matches (case-insensitively), or the owner made an open link. */
export function invitationRefusal(inv: { email: string; anyoneWithLink: number }, accountEmail: string): string | null {
  if (inv.anyoneWithLink === 1 || inv.email.toLowerCase() === accountEmail.toLowerCase()) return null;
  return `This invitation was sent to ${maskEmail(inv.email)}, and you are signed in as ${accountEmail}. Sign in with the address it was sent to, or ask the owner for a new invitation.`;
}

export async function acceptInvitation(db: Kysely<Database>, token: string, userId: string, now = new Date()) {
  return db.transaction().execute(async (trx) => {
    // Locked: two accepts of one link at once → one membership, one 410.
    const inv = await forUpdate(trx, trx.selectFrom('invitations').selectAll().where('tokenHash', '=', hashToken(token))).executeTakeFirst();
    if (!inv) throw new Refused(404, 'This invitation does not exist.');
    // Used, withdrawn, sent again with a new link, or expired: gone, and the answer says which.
    const gone = invitationGone(inv, now.getTime());
    if (gone) throw new Refused(410, gone);
    const u = await trx.selectFrom('users').select(['name', 'email']).where('id', '=', userId).executeTakeFirstOrThrow();
    const refusal = invitationRefusal(inv, u.email);
    if (refusal) throw new Refused(403, refusal);
    const existing = await trx
      .selectFrom('memberships')
      .select('role')
      .where('seriesId', '=', inv.seriesId)
      .where('userId', '=', userId)
      .executeTakeFirst();
    if (existing) throw new Refused(409, 'You are already a member of this series.');
    await trx.insertInto('memberships').values({ seriesId: inv.seriesId, userId, role: inv.role, createdAt: now.toISOString() }).execute();
    await trx.updateTable('invitations').set({ acceptedAt: now.toISOString(), acceptedBy: userId }).where('id', '=', inv.id).execute();
    await recordActivity(trx, { seriesId: inv.seriesId, userId, kind: 'member.joined', summary: `${u.name} joined as ${inv.role}` });
    return { seriesId: inv.seriesId, role: inv.role };
  });
}

async function ownerCount(db: Kysely<Database> | Transaction<Database>, seriesId: string) {
  const r = await db
    .selectFrom('memberships')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .where('seriesId', '=', seriesId)
    .where('role', '=', 'owner')
    .executeTakeFirstOrThrow();
  return Number(r.n);
}

export async function changeRole(db: Kysely<Database>, seriesId: string, userId: string, role: Role) {
  return db.transaction().execute(async (trx) => {
    // Two owners demoting each other at once must not leave the series without one.
    await lockRow(trx, 'series', seriesId);
    await changeRoleLocked(trx, seriesId, userId, role);
  });
}

async function changeRoleLocked(db: Transaction<Database>, seriesId: string, userId: string, role: Role) {
  const m = await db.selectFrom('memberships').select('role').where('seriesId', '=', seriesId).where('userId', '=', userId).executeTakeFirst();
  if (!m) throw new Refused(404, 'Not a member of this series.');
  if (m.role === 'owner' && role !== 'owner' && (await ownerCount(db, seriesId)) <= 1) {
    throw new Refused(409, 'A series keeps at least one owner: make someone else owner first.');
  }
  await db.updateTable('memberships').set({ role }).where('seriesId', '=', seriesId).where('userId', '=', userId).execute();
}

export async function removeMember(db: Kysely<Database>, seriesId: string, userId: string) {
  return db.transaction().execute(async (trx) => {
    await lockRow(trx, 'series', seriesId);
    await removeMemberLocked(trx, seriesId, userId);
  });
}

async function removeMemberLocked(db: Transaction<Database>, seriesId: string, userId: string) {
  const m = await db.selectFrom('memberships').select('role').where('seriesId', '=', seriesId).where('userId', '=', userId).executeTakeFirst();
  if (!m) throw new Refused(404, 'Not a member of this series.');
  if (m.role === 'owner' && (await ownerCount(db, seriesId)) <= 1) {
    throw new Refused(409, 'The last owner cannot be removed: make another member owner first, so someone can still manage the series.');
  }
  await db.deleteFrom('memberships').where('seriesId', '=', seriesId).where('userId', '=', userId).execute();
  // Removed from their last series: nothing left to see, and their sessions end (issue 13, sessions end on the server).
  const left = await db.selectFrom('memberships').select('seriesId').where('userId', '=', userId).limit(1).executeTakeFirst();
  if (!left) await endAllSessions(db, userId);
}
