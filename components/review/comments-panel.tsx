'use client';
// Comment threads of a gag: pinned to the gag, a pass, a panel, a beat or a
// point; replies; edit your own; resolve and reopen; @name mentions a member.
import { MessageSquare } from 'lucide-react';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import type { ThreadDto } from '@/db/queries/comments';
import { useMembers } from '@/hooks/use-members';
import { type PostedComment, useComments } from '@/hooks/use-review';
import { BEAT_KINDS, BEAT_LABELS, type BeatKind } from '@/lib/gags/status';
import { messageOf } from '@/lib/http/client';
import { pointWhere } from '@/lib/review/words';
import { type MentionMember, findMentions, mentionOutcome, mentionWarning } from '@/lib/review/mentions';
import { MentionField } from './mention-field';

/**
 * Posting with mentions: a draft whose mentions match nobody (or several) is held once, with the
 * warning in an alert, and goes on the second press; after posting, what the server says it did.
 */
function useMentionPost(members: MentionMember[] | null, post: (b: Record<string, unknown>) => Promise<PostedComment>) {
  const [heldFor, setHeldFor] = useState<string | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const send = async (body: Record<string, unknown> & { body: string }): Promise<boolean> => {
    const warning = members ? mentionWarning(findMentions(body.body, members)) : null;
    if (warning && heldFor !== body.body) {
      setHeldFor(body.body);
      setNotice(null);
      return false;
    }
    const answer = await post(body);
    setHeldFor(null);
    setNotice(mentionOutcome(answer));
    return true;
  };
  return { send, held: (draft: string) => heldFor === draft, notice, clearNotice: () => setNotice(null) };
}

export function pinLabel(c: Pick<ThreadDto, 'target' | 'passNumber' | 'panel' | 'beat' | 'x' | 'y'>): string {
  const panel = c.panel !== null ? `panel ${c.panel + 1} (${BEAT_LABELS[BEAT_KINDS[c.panel]!]})` : '';
  switch (c.target) {
    case 'gag':
      return 'The whole gag';
    case 'beat':
      return `Beat: ${c.beat ? BEAT_LABELS[c.beat] : '?'}`;
    case 'pass':
      return `Pass ${c.passNumber}`;
    case 'panel':
      return `Pass ${c.passNumber}, ${panel}`;
    case 'point':
      return `Pass ${c.passNumber}, ${panel}, ${pointWhere(c.x ?? 0, c.y ?? 0)}`;
  }
}

type Pin = { target: 'gag' | 'pass' | 'panel' | 'beat' | 'point'; passId?: string; panel?: number; beat?: BeatKind; x?: number; y?: number };

export function CommentsPanel({
  gagId,
  seriesId,
  meId,
  canComment,
  passes,
  onlyPassId,
  point,
  onPosted,
}: {
  gagId: string;
  seriesId: string;
  meId: string;
  canComment: boolean;
  passes: { id: string; number: number }[];
  /** In the editor: only this pass's threads (and the gag's own). */
  onlyPassId?: string;
  /** A point picked on the canvas, offered as a pin. */
  point?: { passId: string; panel: number; x: number; y: number };
  onPosted?: () => void;
}) {
  const { data, post, patch } = useComments(gagId);
  const { data: memberList } = useMembers(seriesId);
  const members = memberList ?? null;
  const mention = useMentionPost(members, post);
  const [pinKey, setPinKey] = useState(onlyPassId ? `pass:${onlyPassId}` : 'gag');
  const [body, setBody] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [showResolved, setShowResolved] = useState(false);
  // A new point pinned on the canvas becomes the target (adjusted while rendering, as React advises).
  const pointKey = point ? `${point.panel}:${point.x}:${point.y}` : null;
  const [seenPoint, setSeenPoint] = useState(pointKey);
  if (pointKey !== seenPoint) {
    setSeenPoint(pointKey);
    if (pointKey) setPinKey('point');
  }
  const threads = (data ?? [])
    .filter((t) => (onlyPassId ? t.passId === onlyPassId || t.target === 'gag' : true))
    .filter((t) => showResolved || !t.resolvedAt);

  const pinOptions: { key: string; label: string; pin: Pin }[] = [
    ...(point
      ? [
          {
            key: 'point',
            label: `Pinned point: panel ${point.panel + 1}, ${pointWhere(point.x, point.y)}`,
            pin: { target: 'point' as const, ...point },
          },
        ]
      : []),
    { key: 'gag', label: 'The whole gag', pin: { target: 'gag' } },
    ...BEAT_KINDS.map((b) => ({ key: `beat:${b}`, label: `Beat: ${BEAT_LABELS[b]}`, pin: { target: 'beat' as const, beat: b } })),
    ...passes
      .filter((p) => !onlyPassId || p.id === onlyPassId)
      .flatMap((p) => [
        { key: `pass:${p.id}`, label: `Pass ${p.number}`, pin: { target: 'pass' as const, passId: p.id } },
        ...BEAT_KINDS.map((b, i) => ({
          key: `panel:${p.id}:${i}`,
          label: `Pass ${p.number}, panel ${i + 1} (${BEAT_LABELS[b]})`,
          pin: { target: 'panel' as const, passId: p.id, panel: i },
        })),
      ]),
  ];

  const submit = async () => {
    setError(null);
    const pin = pinOptions.find((o) => o.key === pinKey)?.pin ?? { target: 'gag' };
    try {
      if (!(await mention.send({ body, ...pin }))) return;
      setBody('');
      if (pin.target === 'point') {
        setPinKey(onlyPassId ? `pass:${onlyPassId}` : 'gag');
        onPosted?.();
      }
    } catch (err) {
      setError(messageOf(err, 'Could not post the comment.'));
    }
  };

  return (
    <section className="panel p-4" aria-labelledby={`comments-${gagId}`}>
      <div className="mb-2 flex items-center justify-between gap-2">
        <h3 id={`comments-${gagId}`} className="inline-flex items-center gap-1.5 text-lg font-extrabold">
          <MessageSquare aria-hidden className="h-5 w-5" /> Comments
        </h3>
        <label className="inline-flex items-center gap-1 text-xs">
          <input type="checkbox" checked={showResolved} onChange={(e) => setShowResolved(e.target.checked)} /> Show resolved
        </label>
      </div>
      {canComment && (
        <div className="mb-4 space-y-2">
          <label className="block text-sm font-bold text-graphite-soft">
            Pin to
            <select className="field mt-1 py-1.5 text-sm" value={pinKey} onChange={(e) => setPinKey(e.target.value)}>
              {pinOptions.map((o) => (
                <option key={o.key} value={o.key}>
                  {o.label}
                </option>
              ))}
            </select>
          </label>
          <div>
            <label htmlFor={`comment-body-${gagId}`} className="block text-sm font-bold text-graphite-soft">
              Comment
            </label>
            <MentionField
              id={`comment-body-${gagId}`}
              value={body}
              onChange={(v) => {
                setBody(v);
                mention.clearNotice();
              }}
              members={members}
              meId={meId}
              placeholder="Type @ to mention a member"
            />
          </div>
          <Button onClick={() => void submit()} disabled={!body.trim()}>
            {mention.held(body) ? 'Post anyway' : 'Post comment'}
          </Button>
          {mention.held(body) && (
            <p role="alert" className="text-sm text-stamp">
              Not posted yet: {mentionWarning(findMentions(body, members ?? []))} Press “Post anyway” to post it as it is.
            </p>
          )}
          {mention.notice && (
            <p role="status" className="text-sm text-graphite-soft" data-testid="mention-outcome">
              {mention.notice}
            </p>
          )}
          {error && (
            <p role="alert" className="text-sm text-stamp">
              {error}
            </p>
          )}
        </div>
      )}
      {threads.length === 0 ? (
        <p className="text-sm text-graphite-faint">No comments{showResolved ? '' : ' open'} yet.</p>
      ) : (
        <ol className="space-y-3">
          {threads.map((t) => (
            <Thread key={t.id} t={t} meId={meId} canComment={canComment} patch={patch} post={post} members={members} />
          ))}
        </ol>
      )}
    </section>
  );
}

function Thread({
  t,
  meId,
  canComment,
  patch,
  post,
  members,
}: {
  t: ThreadDto;
  meId: string;
  canComment: boolean;
  patch: (id: string, b: { body?: string; resolved?: boolean }) => Promise<void>;
  post: (b: Record<string, unknown>) => Promise<PostedComment>;
  members: MentionMember[] | null;
}) {
  const [reply, setReply] = useState('');
  const mention = useMentionPost(members, post);
  const [editing, setEditing] = useState<string | null>(null);
  const [draft, setDraft] = useState('');
  const all = [t, ...t.replies];
  return (
    <li
      className={`rounded-md border p-3 ${t.resolvedAt ? 'border-paper-edge bg-paper-deep/40 opacity-80' : 'border-paper-edge bg-white/60'}`}
      data-testid="comment-thread"
    >
      <p className="mb-1 text-xs font-bold uppercase tracking-wide text-ink">{pinLabel(t)}</p>
      <ul className="space-y-2">
        {all.map((c) => (
          <li key={c.id} className="text-sm">
            <span className="font-bold">{c.author}</span>{' '}
            <span className="text-xs text-graphite-faint" suppressHydrationWarning>
              {new Date(c.createdAt).toLocaleString()}
              {c.editedAt ? ' · edited' : ''}
            </span>
            {editing === c.id ? (
              <div className="mt-1 space-y-1">
                <textarea className="field" rows={2} value={draft} onChange={(e) => setDraft(e.target.value)} aria-label="Edit comment" />
                <div className="flex gap-2">
                  <Button
                    onClick={async () => {
                      await patch(c.id, { body: draft });
                      setEditing(null);
                    }}
                  >
                    Save
                  </Button>
                  <Button variant="ghost" onClick={() => setEditing(null)}>
                    Cancel
                  </Button>
                </div>
              </div>
            ) : (
              <p className="whitespace-pre-wrap">{c.body}</p>
            )}
            {c.authorId === meId && editing !== c.id && canComment && (
              <button
                type="button"
                className="text-xs text-ink hover:underline"
                onClick={() => {
                  setEditing(c.id);
                  setDraft(c.body);
                }}
              >
                Edit
              </button>
            )}
          </li>
        ))}
      </ul>
      {canComment && (
        <div className="mt-2 flex flex-wrap items-center gap-2">
          {!t.resolvedAt && (
            <>
              <div className="min-w-0 flex-1">
                <MentionField
                  value={reply}
                  onChange={(v) => {
                    setReply(v);
                    mention.clearNotice();
                  }}
                  members={members}
                  meId={meId}
                  label="Reply"
                  rows={1}
                  placeholder="Reply…"
                  className="field py-1 text-sm"
                />
              </div>
              <Button
                variant="secondary"
                disabled={!reply.trim()}
                onClick={async () => {
                  if (await mention.send({ body: reply, parentId: t.id })) setReply('');
                }}
              >
                {mention.held(reply) ? 'Reply anyway' : 'Reply'}
              </Button>
            </>
          )}
          <Button variant="ghost" onClick={() => void patch(t.id, { resolved: !t.resolvedAt })}>
            {t.resolvedAt ? 'Reopen' : 'Resolve'}
          </Button>
        </div>
      )}
      {mention.held(reply) && (
        <p role="alert" className="mt-1 text-xs text-stamp">
          Not sent yet: {mentionWarning(findMentions(reply, members ?? []))} Press “Reply anyway” to send it as it is.
        </p>
      )}
      {mention.notice && (
        <p role="status" className="mt-1 text-xs text-graphite-soft">
          {mention.notice}
        </p>
      )}
      {t.resolvedAt && <p className="mt-1 text-xs text-graphite-faint">Resolved by {t.resolvedBy}</p>}
    </li>
  );
}
