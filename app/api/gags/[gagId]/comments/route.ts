import { createComment, listThreads, mentionsIn } from '@/db/queries/comments';
import { findGag } from '@/db/queries/gags';
import { notifyMentions } from '@/lib/mail/notify';
import { withSeriesRole } from '@/lib/http/route';
import { commentCreateSchema } from '@/lib/validation/review';
import { byGagId } from '@/lib/http/series-of';
import { gagChanged } from '@/lib/live/events';

type Params = { gagId: string };
const seriesOf = byGagId;

/** Threads, oldest first, each with its replies. */
export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => Response.json(await listThreads(db, params.gagId)));

/**
 * A new thread or a reply; "@Name" mentions a member, who is told by e-mail. The answer says what the
 * mentions matched (`mentions`: matched, unmatched, ambiguous) and whom an e-mail went to (`notified`).
 */
export const POST = withSeriesRole<Params, typeof commentCreateSchema>(
  'comment',
  seriesOf,
  { body: commentCreateSchema },
  async ({ db, params, user, seriesId, body }) => {
    const input = body;
    const comment = await createComment(db, { ...input, gagId: params.gagId, seriesId, authorId: user.id });
    await gagChanged(seriesId, params.gagId, ['comments'], ['activity']);
    const gag = await findGag(db, params.gagId);
    const mentions = await mentionsIn(db, seriesId, input.body);
    const notified =
      gag && mentions.matched.length
        ? await notifyMentions(db, { members: mentions.matched, author: user, gag: { id: gag.id, seriesId, title: gag.title }, body: input.body })
        : [];
    return Response.json({ ...comment, mentioned: mentions.matched.map((m) => m.userId), mentions, notified }, { status: 201 });
  },
);
