// What the mail services read and write: the outgoing mail log, whom to tell, and a stamp as its notice needs it.
import type { Kysely } from 'kysely';
import type { Database } from '../database';

export async function logMail(
  db: Kysely<Database>,
  entry: { to: string; subject: string; kind: string; messageId: string | null; error: string | null; createdAt: string },
): Promise<void> {
  await db.insertInto('mailLog').values(entry).execute();
}

/** Where to write to a person, or null when they turned notifications off (or are gone). */
export async function notifiableAddress(db: Kysely<Database>, userId: string): Promise<string | null> {
  const u = await db.selectFrom('users').select(['email', 'notifyEmail']).where('id', '=', userId).executeTakeFirst();
  return u && u.notifyEmail ? u.email : null;
}

export async function stampNotice(db: Kysely<Database>, stampId: string) {
  return db
    .selectFrom('stamps as s')
    .innerJoin('gags as g', 'g.id', 's.gagId')
    .innerJoin('passes as p', 'p.id', 's.passId')
    .select(['s.decision', 's.note', 'g.id as gagId', 'g.seriesId', 'g.title', 'g.createdBy', 'p.number'])
    .where('s.id', '=', stampId)
    .executeTakeFirst();
}
