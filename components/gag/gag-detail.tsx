'use client';
// One gag: title, premise, status and the four beat notes, autosaved.
// Beats sit in the 2×2 order they take on the page.
import { Trash2 } from 'lucide-react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { SaveIndicator } from '@/components/ui/save-indicator';
import { StatusBadge } from '@/components/ui/status-badge';
import type { GagDto } from '@/db/queries/gags';
import { useAutosave } from '@/hooks/use-autosave';
import { useGag } from '@/hooks/use-gag';
import { ROLE_LABELS, type Role, can } from '@/lib/auth/permissions';
import { BeatComments } from '@/components/review/beat-comments';
import { useComments } from '@/hooks/use-review';
import { BEAT_KINDS, BEAT_LABELS, type BeatKind, type GagStatus, STATUS_LABELS } from '@/lib/gags/status';
import { messageOf } from '@/lib/http/client';
import { onFirstUse } from '@/lib/forms/lazy-resolver';

/** The title and premise rules, loaded with the first edit. */
const fieldRules = onFirstUse(() => import('@/lib/validation/gag'));
import { StatusSelect } from './status-select';

type Draft = { title?: string; premise?: string; beats?: Partial<Record<BeatKind, string>> };

const BEAT_HINTS: Record<BeatKind, string> = {
  setup: 'Who, where, what is normal.',
  build: 'Push it: the situation grows.',
  turn: 'The surprise the reader did not see coming.',
  payoff: 'The laugh, readable at a glance.',
};

function mergeDrafts(a: Draft, b: Draft): Draft {
  return { ...a, ...b, beats: a.beats || b.beats ? { ...a.beats, ...b.beats } : undefined };
}

export function GagDetail({ seriesId, seriesTitle, role, initial }: { seriesId: string; seriesTitle: string; role: Role; initial: GagDto }) {
  const router = useRouter();
  const { data, update, remove } = useGag(initial.id, initial);
  const gag = data ?? initial;
  const canEdit = can(role, 'edit');
  const canDelete = can(role, 'manage');
  const { data: threads } = useComments(initial.id);

  const [title, setTitle] = useState(initial.title);
  const [premise, setPremise] = useState(initial.premise);
  const [notes, setNotes] = useState<Record<BeatKind, string>>(
    () => Object.fromEntries(BEAT_KINDS.map((k) => [k, initial.beats.find((b) => b.kind === k)?.note ?? ''])) as Record<BeatKind, string>,
  );
  const [fieldError, setFieldError] = useState<{ title?: string; premise?: string }>({});
  const [statusError, setStatusError] = useState<string | null>(null);
  const [confirming, setConfirming] = useState(false);
  const [deleting, setDeleting] = useState(false);

  const autosave = useAutosave<Draft>({
    merge: mergeDrafts,
    save: async (draft) => {
      await update({
        title: draft.title,
        premise: draft.premise,
        beats: draft.beats ? Object.entries(draft.beats).map(([kind, note]) => ({ kind: kind as BeatKind, note: note ?? '' })) : undefined,
      });
    },
  });

  function editTitle(v: string) {
    setTitle(v);
    void fieldRules().then(({ gagTitle }) => {
      const r = gagTitle.safeParse(v);
      setFieldError((e) => ({ ...e, title: r.success ? undefined : r.error.issues[0]?.message }));
      if (r.success) autosave.queue({ title: r.data });
    });
  }
  function editPremise(v: string) {
    setPremise(v);
    void fieldRules().then(({ gagPremise }) => {
      const r = gagPremise.safeParse(v);
      setFieldError((e) => ({ ...e, premise: r.success ? undefined : r.error.issues[0]?.message }));
      if (r.success) autosave.queue({ premise: r.data });
    });
  }
  function editNote(kind: BeatKind, v: string) {
    setNotes((n) => ({ ...n, [kind]: v }));
    autosave.queue({ beats: { [kind]: v } });
  }
  async function changeStatus(next: GagStatus) {
    setStatusError(null);
    try {
      await autosave.flush();
      await update({ status: next });
    } catch (err) {
      setStatusError(messageOf(err, 'Could not change the status.'));
    }
  }
  async function doDelete() {
    setDeleting(true);
    try {
      await remove();
      router.push(`/series/${seriesId}`);
      router.refresh();
    } catch (err) {
      setDeleting(false);
      setConfirming(false);
      setStatusError(messageOf(err, 'Could not delete the gag.'));
    }
  }

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-start justify-between gap-4">
        <div className="min-w-0 flex-1 space-y-2">
          <p className="text-sm text-graphite-faint">
            <Link href={`/series/${seriesId}`} className="hover:underline">
              {seriesTitle}
            </Link>{' '}
            / gag · your role: <strong>{ROLE_LABELS[role]}</strong>
          </p>
          {canEdit ? (
            <>
              {/* The page's heading is the gag's name; people who can edit see it as the title field below. */}
              <h1 className="sr-only">{title || 'Untitled gag'}</h1>
              <label htmlFor="gag-title" className="sr-only">
                Title
              </label>
              <input
                id="gag-title"
                value={title}
                onChange={(e) => editTitle(e.target.value)}
                onBlur={() => void autosave.flush()}
                className="w-full rounded-md border border-transparent bg-transparent px-1 font-display text-3xl font-extrabold hover:border-paper-edge focus:border-ink focus:bg-white/70 focus:outline-none"
                aria-invalid={!!fieldError.title}
                aria-describedby={fieldError.title ? 'gag-title-error' : undefined}
              />
              {fieldError.title && (
                <p id="gag-title-error" role="alert" className="text-sm text-stamp">
                  {fieldError.title}
                </p>
              )}
              <label htmlFor="gag-premise" className="block text-sm font-bold text-graphite-soft">
                Premise
              </label>
              <input
                id="gag-premise"
                value={premise}
                onChange={(e) => editPremise(e.target.value)}
                onBlur={() => void autosave.flush()}
                className="field"
                placeholder="What happens, in one line"
                aria-invalid={!!fieldError.premise}
              />
              {fieldError.premise && (
                <p role="alert" className="text-sm text-stamp">
                  {fieldError.premise}
                </p>
              )}
            </>
          ) : (
            <>
              <h1 className="text-3xl font-extrabold">{gag.title}</h1>
              <p className="text-graphite-soft">{gag.premise || <em>No premise yet.</em>}</p>
            </>
          )}
        </div>
        <div className="flex flex-col items-end gap-2">
          <StatusBadge status={gag.status} />
          {canEdit && (
            <div className="flex items-center gap-2">
              <label htmlFor="gag-status" className="text-sm font-bold text-graphite-soft">
                Status
              </label>
              <StatusSelect id="gag-status" label="Status" status={gag.status} onChange={(s) => void changeStatus(s)} />
            </div>
          )}
          {canEdit && <SaveIndicator state={autosave.state} message={autosave.message} />}
          {canDelete && (
            <Button variant="ghost" onClick={() => setConfirming(true)} className="text-stamp">
              <Trash2 aria-hidden className="h-4 w-4" /> Delete gag
            </Button>
          )}
        </div>
      </div>
      {statusError && (
        <p role="alert" className="rounded-md border border-stamp/40 bg-stamp-light px-3 py-2 text-sm text-stamp">
          {statusError}
        </p>
      )}
      {gag.status === 'ready_to_ink' && (
        <p className="text-sm text-graphite-soft">
          Stamped <strong>{STATUS_LABELS.ready_to_ink}</strong>
          {gag.stamp?.standing ? ` on pass ${gag.stamp.passNumber}` : ''}: the approved pass goes to the drawing desk.
        </p>
      )}

      <section aria-labelledby="beats-title">
        <h2 id="beats-title" className="mb-3 text-xl font-extrabold">
          The four beats
        </h2>
        <div className="grid gap-3 sm:grid-cols-2">
          {BEAT_KINDS.map((kind, i) => (
            <div key={kind} className="panel flex min-h-[11rem] flex-col p-3">
              <div className="mb-2 flex items-baseline justify-between">
                <span className="font-display text-lg font-extrabold">
                  <span aria-hidden className="mr-2 text-marker-40">
                    {i + 1}
                  </span>
                  <label htmlFor={`beat-${kind}`}>{BEAT_LABELS[kind]}</label>
                </span>
                <span className="text-xs text-graphite-faint">{BEAT_HINTS[kind]}</span>
              </div>
              {canEdit ? (
                <textarea
                  id={`beat-${kind}`}
                  value={notes[kind]}
                  onChange={(e) => editNote(kind, e.target.value)}
                  onBlur={() => void autosave.flush()}
                  className="field flex-1 resize-y"
                  rows={4}
                  maxLength={2000}
                  placeholder={`What the reader sees in the ${BEAT_LABELS[kind].toLowerCase()} panel`}
                />
              ) : (
                <p id={`beat-${kind}`} className="whitespace-pre-wrap text-graphite">
                  {notes[kind] || <em className="text-graphite-faint">No note yet.</em>}
                </p>
              )}
              <BeatComments threads={threads} beat={kind} />
            </div>
          ))}
        </div>
      </section>

      <ConfirmDialog
        open={confirming}
        title="Delete this gag?"
        body={<>“{gag.title}” and its beat notes will be gone for everyone in the series. This cannot be undone.</>}
        confirmLabel={deleting ? 'Deleting…' : 'Delete gag'}
        busy={deleting}
        onCancel={() => setConfirming(false)}
        onConfirm={() => void doDelete()}
      />
    </div>
  );
}
