import { findComment, updateComment } from '@/db/queries/comments';
import { jsonError, withSeriesRole } from '@/lib/http/route';
import { commentPatchSchema } from '@/lib/validation/review';
import { byCommentId } from '@/lib/http/series-of';
import { gagChanged } from '@/lib/live/events';

type Params = { commentId: string };
const seriesOf = byCommentId;

/** `{ body }` edits your own comment; `{ resolved: true | false }` resolves or reopens a thread. */
export const PATCH = withSeriesRole<Params, typeof commentPatchSchema>(
  'comment',
  seriesOf,
  { body: commentPatchSchema },
  async ({ db, params, user, seriesId, body }) => {
    const patch = body;
    const c = await findComment(db, params.commentId);
    if (!c) return jsonError(404, 'Not found.');
    if (patch.body !== undefined && c.authorId !== user.id) return jsonError(403, 'You can edit only your own comments.');
    if (patch.resolved !== undefined && c.parentId) return jsonError(422, 'Resolve the thread, not a reply.');
    const updated = await updateComment(db, params.commentId, patch, user.id);
    await gagChanged(seriesId, c.gagId, ['comments']);
    return Response.json(updated);
  },
);
