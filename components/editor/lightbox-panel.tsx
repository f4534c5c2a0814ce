'use client';
// The lightbox side panel of the editor: upload or pick a scan, place it on the
// page or a panel, and set its opacity, size, quarter turn and visibility, with
// the print check of each placed scan. Moving and corner-scaling happen on the
// canvas with the "Arrange the lightbox" tool.
import { Eye, EyeOff, ImagePlus, Maximize2, RotateCw, Trash2 } from 'lucide-react';
import { useEffect, useRef, useState } from 'react';
import { ImageFilesInput, UploadJobList, type UploadJob } from '@/components/uploads/upload-jobs';
import type { UploadListItem } from '@/db/queries/uploads';
import { lightboxPpi, printCheck } from '@/lib/print/ppi';
import { BEAT_KINDS, BEAT_LABELS } from '@/lib/gags/status';
import type { Lightbox } from '@/lib/strokes/types';

export type Target = number | null;

export const targetLabel = (t: Target) => (t === null ? 'Whole page' : `Panel ${t + 1} ${BEAT_LABELS[BEAT_KINDS[t]!]}`);

/** A value that follows `value` but holds the person's edit until `commit` has run (debounced). */
function useDraft(value: number, commit: (v: number) => void, wait = 250) {
  const [draft, setDraft] = useState<number | null>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  useEffect(
    () => () => {
      if (timer.current) clearTimeout(timer.current);
    },
    [],
  );
  const change = (v: number) => {
    setDraft(v);
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => {
      commit(v);
      setDraft(null);
    }, wait);
  };
  return [draft ?? value, change] as const;
}

function SliderRow(p: { label: string; aria: string; min: number; max: number; value: number; onChange: (v: number) => void }) {
  return (
    <label className="flex items-center gap-2 text-xs">
      <span className="w-14">{p.label}</span>
      <input
        type="range"
        min={p.min}
        max={p.max}
        step={5}
        value={p.value}
        aria-label={p.aria}
        onChange={(e) => p.onChange(Number(e.target.value))}
        className="flex-1"
      />
      <output className="w-9 text-right">{p.value}%</output>
    </label>
  );
}

function PlacedLightbox(p: {
  l: Lightbox;
  upload: UploadListItem | undefined;
  canDraw: boolean;
  selected: boolean;
  fitWidth: number;
  onSelect: () => void;
  onChange: (after: Lightbox) => void;
  onPreview: (after: Lightbox | null) => void;
  onTurn: () => void;
  onFit: () => void;
  onScale: (width: number) => void;
  onRemove: () => void;
}) {
  const { l, upload } = p;
  const [opacity, setOpacity] = useDraft(Math.round(l.opacity * 100), (v) => p.onChange({ ...l, opacity: v / 100 }));
  const sizePct = Math.round((l.w / p.fitWidth) * 100);
  const [size, setSize] = useDraft(sizePct, (v) => p.onScale((p.fitWidth * v) / 100));
  const check = upload ? printCheck(lightboxPpi(l, upload)) : null;
  const name = upload?.name ?? 'Deleted scan';
  return (
    <li
      className={`space-y-1 rounded border p-2 ${p.selected ? 'border-ink' : 'border-paper-edge'}`}
      data-testid="lightbox-item"
      aria-label={`Lightbox ${name}`}
    >
      <div className="flex items-center gap-2">
        {upload ? (
          // eslint-disable-next-line @next/next/no-img-element -- served by our own route after a role check
          <img src={`/api/uploads/${upload.id}/preview`} alt="" className="h-10 w-10 rounded bg-white object-contain" />
        ) : (
          <span className="h-10 w-10 rounded border border-dashed border-graphite-faint" aria-hidden />
        )}
        <button type="button" className="min-w-0 flex-1 text-left" onClick={p.onSelect} aria-pressed={p.selected}>
          <span className="block truncate font-bold">{name}</span>
          <span className="text-xs text-graphite-faint">{targetLabel(l.panel)}</span>
        </button>
        {p.canDraw && (
          <button
            type="button"
            className="rounded p-1 hover:bg-paper-deep"
            aria-label={l.visible ? `Hide ${name}` : `Show ${name}`}
            title={l.visible ? 'Hide' : 'Show'}
            onClick={() => p.onChange({ ...l, visible: !l.visible })}
          >
            {l.visible ? <Eye aria-hidden className="h-4 w-4" /> : <EyeOff aria-hidden className="h-4 w-4" />}
          </button>
        )}
      </div>
      {check && (
        <p
          className={`text-xs ${check.level === 'low' ? 'font-bold text-stamp' : 'text-graphite-soft'}`}
          data-testid="print-check"
          role={check.level === 'low' ? 'status' : undefined}
        >
          Print check: {check.message}
        </p>
      )}
      {!upload && <p className="text-xs text-stamp">The scan was deleted; this frame keeps its place.</p>}
      {p.canDraw && (
        <>
          <SliderRow
            label="Opacity"
            aria={`Opacity of ${name}`}
            min={5}
            max={100}
            value={opacity}
            onChange={(v) => {
              setOpacity(v);
              p.onPreview({ ...l, opacity: v / 100 });
            }}
          />
          <SliderRow label="Size" aria={`Size of ${name}, percent of a fit`} min={10} max={300} value={size} onChange={setSize} />
          <div className="flex flex-wrap gap-1 text-xs">
            <button type="button" className="inline-flex items-center gap-1 rounded px-2 py-0.5 hover:bg-paper-deep" onClick={p.onTurn}>
              <RotateCw aria-hidden className="h-3 w-3" /> Turn 90°
            </button>
            <button type="button" className="inline-flex items-center gap-1 rounded px-2 py-0.5 hover:bg-paper-deep" onClick={p.onFit}>
              <Maximize2 aria-hidden className="h-3 w-3" /> Fit
            </button>
            <button type="button" className="inline-flex items-center gap-1 rounded px-2 py-0.5 text-stamp hover:bg-paper-deep" onClick={p.onRemove}>
              <Trash2 aria-hidden className="h-3 w-3" /> Take away
            </button>
          </div>
        </>
      )}
    </li>
  );
}

export function LightboxPanel(p: {
  lightboxes: Lightbox[];
  uploads: UploadListItem[];
  canDraw: boolean;
  selectedId: string | null;
  fitWidthOf: (l: Lightbox) => number;
  jobs: UploadJob[];
  startUpload: (files: FileList | File[], target: Target) => void;
  onSelect: (id: string) => void;
  onPlace: (uploadId: string, target: Target) => void;
  onChange: (before: Lightbox, after: Lightbox) => void;
  onPreview: (after: Lightbox | null) => void;
  onTurn: (l: Lightbox) => void;
  onFit: (l: Lightbox) => void;
  onScale: (l: Lightbox, width: number) => void;
  onRemove: (l: Lightbox) => void;
}) {
  const [target, setTarget] = useState<Target>(null);
  const input = useRef<HTMLInputElement>(null);
  const uploadsById = new Map(p.uploads.map((u) => [u.id, u]));
  return (
    <section className="panel space-y-2 p-3 text-sm" aria-labelledby="lightbox-title">
      <h2 id="lightbox-title" className="font-display text-lg font-extrabold">
        Lightbox
      </h2>
      <p className="text-xs text-graphite-soft">A scan under the strokes, to draw over. It is not ink: findings and thumbnails leave it out.</p>
      {p.lightboxes.length > 0 && (
        <ul className="space-y-2" aria-label="Placed scans">
          {p.lightboxes.map((l) => (
            <PlacedLightbox
              key={l.id}
              l={l}
              upload={uploadsById.get(l.uploadId)}
              canDraw={p.canDraw}
              selected={p.selectedId === l.id}
              fitWidth={p.fitWidthOf(l)}
              onSelect={() => p.onSelect(l.id)}
              onChange={(after) => p.onChange(l, after)}
              onPreview={p.onPreview}
              onTurn={() => p.onTurn(l)}
              onFit={() => p.onFit(l)}
              onScale={(w) => p.onScale(l, w)}
              onRemove={() => p.onRemove(l)}
            />
          ))}
        </ul>
      )}
      {p.canDraw && (
        <div className="space-y-2 border-t border-paper-edge pt-2">
          <label className="flex items-center gap-2 text-xs">
            <span>Place on</span>
            <select
              value={target === null ? 'page' : String(target)}
              onChange={(e) => setTarget(e.target.value === 'page' ? null : Number(e.target.value))}
              className="rounded border border-paper-edge bg-white px-1 py-0.5"
              aria-label="Place the scan on"
            >
              <option value="page">{targetLabel(null)}</option>
              {BEAT_KINDS.map((_, i) => (
                <option key={i} value={i}>
                  {targetLabel(i)}
                </option>
              ))}
            </select>
          </label>
          <ul className="grid grid-cols-3 gap-2" aria-label="Scans in this series">
            {p.uploads.map((u) => (
              <li key={u.id}>
                <button
                  type="button"
                  className="w-full rounded border border-paper-edge bg-white p-1 text-left text-[10px] hover:border-ink"
                  onClick={() => p.onPlace(u.id, target)}
                  aria-label={`Place ${u.name} on ${targetLabel(target).toLowerCase()}`}
                >
                  {/* eslint-disable-next-line @next/next/no-img-element -- served by our own route after a role check */}
                  <img src={`/api/uploads/${u.id}/preview`} alt="" className="aspect-square w-full object-contain" />
                  <span className="block truncate">{u.name}</span>
                </button>
              </li>
            ))}
          </ul>
          <button
            type="button"
            className="inline-flex items-center gap-1 rounded border border-paper-edge px-2 py-1 text-xs hover:bg-paper-deep"
            onClick={() => input.current?.click()}
          >
            <ImagePlus aria-hidden className="h-4 w-4" /> Upload and place…
          </button>
          <ImageFilesInput ref={input} label="Upload scans to place" onFiles={(files) => p.startUpload(files, target)} />
          <p className="text-xs text-graphite-faint">…or drop image files on the canvas: the first lands on the panel under the pointer.</p>
          <UploadJobList jobs={p.jobs} narrow />
        </div>
      )}
    </section>
  );
}
