// Who is told what by e-mail. People who turned notifications off get none
// (invitations are not notifications: they go to someone not yet a member).
import 'server-only';
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import { notifiableAddress, stampNotice } from '@/db/queries/mail';
import { type Mail, mentionMail, stampMail } from './templates';
import { sendMail } from './transport';

/** The address links in e-mails point to. */
export function appUrl(): string {
  return (process.env.NEXTAUTH_URL || process.env.APP_URL || `http://localhost:${process.env.PORT || 3000}`).replace(/\/$/, '');
}

async function tell(db: Kysely<Database>, userId: string, kind: string, mail: Mail) {
  const address = await notifiableAddress(db, userId);
  if (address) await sendMail(db, address, kind, mail);
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
    }),
  );
}

/** Members mentioned in a comment, except its author. */
export async function notifyMentions(
  db: Kysely<Database>,
  input: { userIds: string[]; author: { id: string; name: string }; gag: { id: string; seriesId: string; title: string }; body: string },
) {
  for (const id of new Set(input.userIds)) {
    if (id === input.author.id) continue;
    await tell(
      db,
      id,
      'mention',
      mentionMail({
        author: input.author.name,
        gagTitle: input.gag.title,
        excerpt: input.body.length > 280 ? `${input.body.slice(0, 277)}…` : input.body,
        link: `${appUrl()}/series/${input.gag.seriesId}/gags/${input.gag.id}`,
      }),
    );
  }
}
