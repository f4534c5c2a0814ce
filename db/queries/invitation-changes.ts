// What an owner does to an invitation after sending it — withdraw it, send it again — and what an
// invitation link tells the sign-up form. Sending again makes a new invitation with a fresh link
// (only a link's hash is stored, so the old link cannot be mailed twice); the old one is withdrawn
// and names its replacement, and its link says so (410).
import { randomBytes, randomUUID } from 'node:crypto';
import type { Kysely } from 'kysely';
import type { Role } from '@/lib/auth/permissions';
import { Refused } from '@/lib/refused';
import type { Database } from '../database';
import { forUpdate } from '../dialect';
import { INVITATION_DAYS, hashToken, invitationGone, maskEmail } from './members';

const NOT_FOUND = 'No such invitation in this series.';

async function lockedInvitation(trx: Kysely<Database>, seriesId: string, invitationId: string) {
  const inv = await forUpdate(trx, trx.selectFrom('invitations').selectAll().where('id', '=', invitationId)).executeTakeFirst();
  if (!inv || inv.seriesId !== seriesId) throw new Refused(404, NOT_FOUND);
  return inv;
}

/** Withdraws an invitation not yet accepted; its link then answers 410. Withdrawing one already withdrawn changes nothing. */
export async function revokeInvitation(db: Kysely<Database>, seriesId: string, invitationId: string, now = new Date()): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const inv = await lockedInvitation(trx, seriesId, invitationId);
    if (inv.acceptedAt) throw new Refused(409, `${inv.email} has already accepted this invitation: remove the member instead.`);
    if (inv.revokedAt) return;
    await trx.updateTable('invitations').set({ revokedAt: now.toISOString() }).where('id', '=', inv.id).execute();
  });
}

export type SentAgain = { id: string; token: string; email: string; role: Role; anyoneWithLink: boolean; expiresAt: Date };

/**
 * Sends an invitation again, expired or not: a new invitation to the same address with the same role and
 * link kind, valid 7 days from now, by `invitedBy`; the old one is withdrawn and points to it.
 */
export async function resendInvitation(
  db: Kysely<Database>,
  input: { seriesId: string; invitationId: string; invitedBy: string },
  now = new Date(),
): Promise<SentAgain> {
  return db.transaction().execute(async (trx) => {
    const inv = await lockedInvitation(trx, input.seriesId, input.invitationId);
    if (inv.acceptedAt) throw new Refused(409, `${inv.email} has already accepted this invitation.`);
    if (inv.replacedBy) throw new Refused(409, 'This invitation was already sent again: send the newer one.');
    if (inv.revokedAt) throw new Refused(409, 'This invitation was withdrawn: invite the person again instead.');
    const member = await trx
      .selectFrom('memberships as m')
      .innerJoin('users as u', 'u.id', 'm.userId')
      .select('u.id')
      .where('m.seriesId', '=', inv.seriesId)
      .where('u.email', '=', inv.email)
      .executeTakeFirst();
    if (member) throw new Refused(409, `${inv.email} is already a member of this series.`);
    const token = randomBytes(24).toString('base64url');
    const id = randomUUID();
    const expiresAt = new Date(now.getTime() + INVITATION_DAYS * 24 * 3600 * 1000);
    await trx
      .insertInto('invitations')
      .values({
        id,
        tokenHash: hashToken(token),
        seriesId: inv.seriesId,
        email: inv.email,
        role: inv.role,
        invitedBy: input.invitedBy,
        createdAt: now.toISOString(),
        expiresAt: expiresAt.toISOString(),
        acceptedAt: null,
        acceptedBy: null,
        revokedAt: null,
        replacedBy: null,
        anyoneWithLink: inv.anyoneWithLink,
      })
      .execute();
    await trx.updateTable('invitations').set({ revokedAt: now.toISOString(), replacedBy: id }).where('id', '=', inv.id).execute();
    return { id, token, email: inv.email, role: inv.role, anyoneWithLink: inv.anyoneWithLink === 1, expiresAt };
  });
}

/**
 * What the sign-up form may take from an invitation link: for a link tied to one address and still
 * good, that address, partly masked for showing. Null for anything else (an open link names nobody).
 */
export async function invitedAddress(db: Kysely<Database>, token: string, now = Date.now()): Promise<{ email: string; masked: string } | null> {
  const inv = await db
    .selectFrom('invitations')
    .select(['email', 'acceptedAt', 'revokedAt', 'replacedBy', 'expiresAt', 'anyoneWithLink'])
    .where('tokenHash', '=', hashToken(token))
    .executeTakeFirst();
  if (!inv || inv.anyoneWithLink === 1 || invitationGone(inv, now)) return null;
  return { email: inv.email, masked: maskEmail(inv.email) };
}
