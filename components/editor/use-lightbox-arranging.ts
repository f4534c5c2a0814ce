'use client';
// Arranging the lightbox: placing an upload on the page or a panel, changing it
// (slider, drag, corner handles, arrow-key nudges, turns) and taking it away, each
// as one pass operation with its undo; uploading scans dropped on the canvas.
import type Konva from 'konva';
import { nanoid } from 'nanoid';
import { useCallback, useMemo, useRef, useState } from 'react';
import { useUploadJobs } from '@/components/uploads/upload-jobs';
import type { UploadDto } from '@/db/queries/uploads';
import { useUploads } from '@/hooks/use-uploads';
import type { Rect } from '@/lib/print/geometry';
import { centreAt, fitInto, scaleTo, turnQuarter, turned } from '@/lib/strokes/lightbox';
import type { Lightbox, Op } from '@/lib/strokes/types';
import type { Target } from './lightbox-panel';
import type { PassSession } from './use-pass-session';
import { type UndoEntry, lightboxChanged, lightboxRemoved } from './undo';

export function useLightboxArranging(o: { seriesId: string; session: PassSession; bleed: Rect; panels: Rect[] }) {
  const { session, bleed, panels } = o;
  const commit: (ops: Op[], undo?: UndoEntry) => void = session.commit;
  const [selected, setSelected] = useState<string | null>(null);
  /** A value shown while a slider moves, before it is committed. */
  const [preview, setPreview] = useState<Lightbox | null>(null);
  const { data: uploads, mutate: reloadUploads } = useUploads(o.seriesId);
  const uploadsById = useMemo(() => new Map((uploads ?? []).map((u) => [u.id, u])), [uploads]);
  const areaOf = useCallback((t: Target) => (t === null ? bleed : panels[t]!), [bleed, panels]);
  const current = (id: string) => session.syncRef.current?.doc.lightboxes.get(id);

  const change = useCallback(
    (before: Lightbox | null, after: Lightbox) => {
      commit([{ op: 'lightbox', lightbox: after }], lightboxChanged(before, after));
      setPreview(null);
    },
    [commit],
  );

  const remove = useCallback(
    (l: Lightbox) => {
      commit([{ op: 'unlightbox', lightboxId: l.id }], lightboxRemoved(l));
      setSelected(null);
    },
    [commit],
  );

  const place = useCallback(
    (upload: Pick<UploadDto, 'id' | 'width' | 'height'>, target: Target) => {
      const l: Lightbox = {
        id: nanoid(),
        uploadId: upload.id,
        panel: target,
        ...fitInto(areaOf(target), upload, 0),
        rotation: 0,
        opacity: 0.5,
        visible: true,
      };
      change(null, l);
      setSelected(l.id);
    },
    [areaOf, change],
  );

  /** After a drag or a corner resize on the canvas: the node's centre and scale become the new box. */
  const edited = (id: string, node: Konva.Node) => {
    const before = current(id);
    if (!before) return;
    // The image node is centred on its box (offset = half its size), so x, y is the centre.
    const k = node.scaleX();
    node.scale({ x: 1, y: 1 });
    const scaled = Math.abs(k - 1) > 1e-6 ? scaleTo(before, Math.max(1, before.w * k)) : before;
    // Its centre stays on its panel (or page), so it can never be dragged out of sight.
    const area = areaOf(before.panel);
    const cx = Math.min(area.x + area.w, Math.max(area.x, node.x()));
    const cy = Math.min(area.y + area.h, Math.max(area.y, node.y()));
    node.position({ x: cx, y: cy });
    change(before, centreAt(scaled, cx, cy));
  };

  /** Arrow keys while arranging: 1 mm (Shift: 10 mm), the centre kept on its panel or page. */
  const nudge = (dx: number, dy: number) => {
    const l = selected ? current(selected) : undefined;
    if (!l) return;
    const area = areaOf(l.panel);
    const cx = Math.min(area.x + area.w, Math.max(area.x, l.x + l.w / 2 + dx));
    const cy = Math.min(area.y + area.h, Math.max(area.y, l.y + l.h / 2 + dy));
    change(l, centreAt(l, cx, cy));
  };

  const removeSelected = () => {
    const l = selected ? current(selected) : undefined;
    if (l) remove(l);
  };

  const turn = (l: Lightbox) => change(l, turnQuarter(l));
  const fit = (l: Lightbox) => {
    const u = uploadsById.get(l.uploadId);
    if (u) change(l, { ...l, ...fitInto(areaOf(l.panel), u, l.rotation) });
  };
  const scale = (l: Lightbox, width: number) => change(l, scaleTo(l, width));
  const placeById = (uploadId: string, target: Target) => {
    const u = uploadsById.get(uploadId);
    if (u) place(u, target);
  };
  /** Width of the box that fits the image into its target, for the size slider. */
  const fitWidthOf = (l: Lightbox) => {
    const u = uploadsById.get(l.uploadId);
    const image = u ?? (turned(l.rotation) ? { width: l.h, height: l.w } : { width: l.w, height: l.h });
    return fitInto(areaOf(l.panel), image, l.rotation).w;
  };

  const dropTarget = useRef<Target>(null);
  const { jobs, start: startJobs } = useUploadJobs(
    o.seriesId,
    useCallback(
      (u: UploadDto, index: number) => {
        void reloadUploads();
        if (index === 0) place(u, dropTarget.current);
      },
      [place, reloadUploads],
    ),
  );
  const upload = useCallback(
    (files: FileList | File[], target: Target) => {
      dropTarget.current = target;
      startJobs(files);
    },
    [startJobs],
  );

  return {
    uploads,
    selected,
    setSelected,
    preview,
    setPreview,
    areaOf,
    change,
    remove,
    removeSelected,
    place,
    placeById,
    edited,
    nudge,
    turn,
    fit,
    scale,
    fitWidthOf,
    jobs,
    upload,
  };
}

export type LightboxArranging = ReturnType<typeof useLightboxArranging>;
