// Whether a person may still read what an open stream shows: still signed in with
// the session that opened it, still a member of the series, and the thing watched
// still belongs to it.
import 'server-only';
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import { authorizeSeries } from '@/lib/auth/guard';
import { userFromRequest } from '@/lib/auth/session';
import { Refused } from '@/lib/http/route';
import { streamQuery } from '@/lib/validation/live';

export function stillReadable(
  userId: string,
  seriesId: string,
  db: Kysely<Database>,
  seriesOf: (db: Kysely<Database>) => Promise<string | null>,
  /** The stream's request: its session must still be live (signed out elsewhere, a password change). */
  req?: Request,
) {
  return async () =>
    (!req || (await userFromRequest(req))?.id === userId) &&
    (await seriesOf(db)) === seriesId &&
    (await authorizeSeries(userId, seriesId, 'read')).ok;
}

/** `?tab=&where=&panel=` of a stream request; 422 when malformed. */
export function streamParams(req: Request) {
  const parsed = streamQuery.safeParse(Object.fromEntries(new URL(req.url).searchParams));
  if (!parsed.success) throw new Refused(422, parsed.error.issues.map((i) => i.message).join(' '));
  return parsed.data;
}
