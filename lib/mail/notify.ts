// Who is told what by e-mail. People who turned notifications off get none
// (invitations are not notifications: they go to someone not yet a member).
import 'server-only';
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import { notifiableAddress, stampNotice } from '@/db/queries/mail';
import { findSeries } from '@/db/queries/series';
import type { Role } from '@/lib/auth/permissions';
import { type Mail, invitationMail, mentionMail, stampMail } from './templates';
import { sendMail } from './transport';

/** The address links in e-mails point to. */
export function appUrl(): string {
  return (process.env.NEXTAUTH_URL || process.env.APP_URL || `http://localhost:${process.env.PORT || 3000}`).replace(/\/$/, '');
}

/** Whether the person was told: notifications on, and the mail went out. */
async function tell(db: Kysely<Database>, userId: string, kind: string, mail: Mail): Promise<boolean> {
  const address = await notifiableAddress(db, userId);
  if (!address) return false;
  return (await sendMail(db, address, kind, mail)).ok;
}

/** Where each person turns these e-mails off: the Notifications section of a series' Members page. */
export function notificationsLink(seriesId: string): string {
  return `${appUrl()}/series/${seriesId}/members#notifications`;
}

/** A stamp on your gag: told to the person who started the gag, unless they stamped it themselves. */
export async function notifyStamp(db: Kysely<Database>, input: { stampId: string; by: { id: string; name: string } }) {
  const s = await stampNotice(db, input.stampId);
  if (!s?.createdBy || s.createdBy === input.by.id) return;
  await tell(
    db,
    s.createdBy,
    'stamp',
    stampMail({
      editor: input.by.name,
      gagTitle: s.title,
      passNumber: s.number,
      decision: s.decision,
      note: s.note,
      link: `${appUrl()}/series/${s.seriesId}/gags/${s.gagId}`,
      settings: notificationsLink(s.seriesId),
    }),
  );
}

/** Members mentioned in a comment, except its author → those told (notifications on, mail sent). */
export async function notifyMentions(
  db: Kysely<Database>,
  input: {
    members: { userId: string; name: string }[];
    author: { id: string; name: string };
    gag: { id: string; seriesId: string; title: string };
    body: string;
  },
): Promise<{ userId: string; name: string }[]> {
  const told: { userId: string; name: string }[] = [];
  for (const m of input.members) {
    if (m.userId === input.author.id || told.some((t) => t.userId === m.userId)) continue;
    const sent = await tell(
      db,
      m.userId,
      'mention',
      mentionMail({
        author: input.author.name,
        gagTitle: input.gag.title,
        excerpt: input.body.length > 280 ? `${input.body.slice(0, 277)}…` : input.body,
        link: `${appUrl()}/series/${input.gag.seriesId}/gags/${input.gag.id}`,
        settings: notificationsLink(input.gag.seriesId),
      }),
    );
    if (sent) told.push({ userId: m.userId, name: m.name });
  }
  return told;
}

/** An invitation's e-mail with its one-time link (sent whatever the person's settings: they are not a member yet). */
export async function sendInvitation(
  db: Kysely<Database>,
  inv: { seriesId: string; inviter: string; email: string; role: Role; token: string; expiresAt: Date; anyoneWithLink: boolean },
): Promise<{ ok: boolean }> {
  const series = await findSeries(db, inv.seriesId);
  return sendMail(
    db,
    inv.email,
    'invitation',
    invitationMail({
      seriesTitle: series!.title,
      inviter: inv.inviter,
      role: inv.role,
      link: `${appUrl()}/invite/${inv.token}`,
      expiresAt: inv.expiresAt,
      forAddress: inv.anyoneWithLink ? null : inv.email,
    }),
  );
}
