'use client';
// The editor's side panel: who is here, the readability findings, the lightbox,
// the beat notes, comments (with a pin being placed) and revisions.
import { BeatComments } from '@/components/review/beat-comments';
import { CommentsPanel } from '@/components/review/comments-panel';
import type { ThreadDto } from '@/db/queries/comments';
import { PresenceBar } from '@/components/review/presence-bar';
import { BEAT_KINDS, BEAT_LABELS, type BeatKind } from '@/lib/gags/status';
import type { Findings } from '@/lib/review/findings';
import type { Lightbox } from '@/lib/strokes/types';
import type { EditorProps } from './types';
import { LightboxPanel } from './lightbox-panel';
import { RevisionsPanel } from './revisions-panel';
import type { LightboxArranging } from './use-lightbox-arranging';

export type PointPin = { panel: number; x: number; y: number };

/** Pins carried from earlier passes are lettered (A, B, …) where this pass's are numbered. */
export const pinLetter = (i: number) => String.fromCharCode(65 + (i % 26));

export function FindingsPanel({
  findings,
  highlight,
  setHighlight,
}: {
  findings: Findings;
  highlight: boolean;
  setHighlight: (on: boolean) => void;
}) {
  return (
    <section className="panel p-3 text-sm" aria-labelledby="editor-findings">
      <div className="mb-1 flex items-center justify-between">
        <h2 id="editor-findings" className="font-display text-lg font-extrabold">
          Findings
        </h2>
        <label className="inline-flex items-center gap-1 text-xs">
          <input type="checkbox" checked={highlight} onChange={(e) => setHighlight(e.target.checked)} /> Highlight
        </label>
      </div>
      <ul className="space-y-0.5" data-testid="editor-findings">
        {findings.panels.map((p) => (
          <li key={p.panel} className={p.inkHeavy || p.roomIntrusions || p.outsideSafe || p.empty ? 'text-stamp' : ''}>
            {p.panel + 1} {BEAT_LABELS[BEAT_KINDS[p.panel]!]}: ink {Math.round(p.inkLoad * 100)}%{p.inkHeavy ? ' (heavy)' : ''}
            {p.roomIntrusions ? ` · ${p.roomIntrusions} in balloon room` : ''}
            {p.outsideSafe ? ` · ${p.outsideSafe} past safe area` : ''}
            {p.empty ? ' · empty' : ''}
          </li>
        ))}
      </ul>
      {findings.beatsMissing.length > 0 && <p className="mt-1 text-stamp">No note: {findings.beatsMissing.map((k) => BEAT_LABELS[k]).join(', ')}</p>}
    </section>
  );
}

export function EditorSidebar(
  p: Pick<EditorProps, 'passId' | 'passNumber' | 'gagId' | 'seriesId' | 'meId' | 'passes' | 'canDraw' | 'canComment' | 'canRestore'> & {
    notes: Record<BeatKind, string>;
    findings: Findings | undefined;
    highlight: boolean;
    setHighlight: (on: boolean) => void;
    lightboxes: Lightbox[];
    arranging: LightboxArranging;
    /** A lightbox chosen in the panel: arrange it on the canvas. */
    onChooseLightbox: (id: string) => void;
    pointPin: PointPin | null;
    setPointPin: (pin: PointPin | null) => void;
    onRestored: () => void;
    threads: ThreadDto[] | undefined;
    /** Open point and panel comments of earlier passes, offered on this one. */
    earlier: ThreadDto[];
    showEarlier: boolean;
    setShowEarlier: (on: boolean) => void;
  },
) {
  const a = p.arranging;
  return (
    <>
      <div className="panel px-3 py-2">
        <PresenceBar gagId={p.gagId} where={`pass:${p.passNumber}`} meId={p.meId} />
      </div>
      {p.findings && <FindingsPanel findings={p.findings} highlight={p.highlight} setHighlight={p.setHighlight} />}
      <LightboxPanel
        lightboxes={p.lightboxes}
        uploads={a.uploads ?? []}
        canDraw={p.canDraw}
        selectedId={a.selected}
        fitWidthOf={a.fitWidthOf}
        jobs={a.jobs}
        startUpload={a.upload}
        onSelect={p.onChooseLightbox}
        onPlace={a.placeById}
        onChange={a.change}
        onPreview={a.setPreview}
        onTurn={a.turn}
        onFit={a.fit}
        onScale={a.scale}
        onRemove={a.remove}
      />
      <section className="panel p-3">
        <h2 className="mb-2 font-display text-lg font-extrabold">Beats</h2>
        <ol className="space-y-2 text-sm">
          {BEAT_KINDS.map((k, i) => (
            <li key={k}>
              <span className="font-bold">
                {i + 1} {BEAT_LABELS[k]}
              </span>
              <p className="text-graphite-soft">{p.notes[k] || <em className="text-graphite-faint">No note yet.</em>}</p>
              <BeatComments threads={p.threads} beat={k} />
            </li>
          ))}
        </ol>
      </section>
      {p.earlier.length > 0 && (
        <section className="panel p-3 text-sm" aria-labelledby="earlier-pins">
          <div className="mb-1 flex items-center justify-between">
            <h2 id="earlier-pins" className="font-display text-lg font-extrabold">
              From earlier passes
            </h2>
            <label className="inline-flex items-center gap-1 text-xs">
              <input type="checkbox" checked={p.showEarlier} onChange={(e) => p.setShowEarlier(e.target.checked)} /> Show on the page
            </label>
          </div>
          <ol className="space-y-1" data-testid="earlier-pins">
            {p.earlier.map((t, i) => (
              <li key={t.id}>
                <span className="font-bold">{pinLetter(i)}</span> from pass {t.passNumber}, panel {(t.panel ?? 0) + 1}:{' '}
                <span className="font-bold">{t.author}:</span> {t.body}
              </li>
            ))}
          </ol>
        </section>
      )}
      <CommentsPanel
        gagId={p.gagId}
        seriesId={p.seriesId}
        meId={p.meId}
        canComment={p.canComment}
        passes={p.passes}
        onlyPassId={p.passId}
        point={p.pointPin ? { passId: p.passId, ...p.pointPin } : undefined}
        onPosted={() => p.setPointPin(null)}
      />
      <RevisionsPanel passId={p.passId} canRestore={p.canRestore} onRestored={p.onRestored} />
    </>
  );
}
