'use client';
// The pass's life in the editor: its sync (outbox, batches, live catch-up) and
// its panel bitmaps, created once per pass; the state React shows of it (rooms,
// lightboxes, counts, the save status); committing operations and the person's
// own undo history. Drawing never redraws the whole pass (see PanelRasters).
import type Konva from 'konva';
import { type RefObject, useCallback, useEffect, useRef, useState } from 'react';
import { useLive, useLiveEvents } from '@/hooks/use-live';
import type { PageSpec } from '@/lib/print/geometry';
import { strokesOfPanel } from '@/lib/strokes/pass-model';
import type { Lightbox, Op, Room, Stroke } from '@/lib/strokes/types';
import { PanelRasters } from './panel-rasters';
import { PassSync, type SyncStatus } from './pass-sync';
import { UndoStack, type UndoEntry } from './undo';

/**
 * The pass's life in the editor. Its strokes are read after the page loads (packed, drawn panel by
 * panel as they arrive); `loaded` says when all of them are in.
 */
export function usePassSession(opts: {
  passId: string;
  canDraw: boolean;
  spec: PageSpec;
  pxPerMm: () => number;
  /** Asked before a change made through `commit` or undo/redo (an approved pass asks first: use-approval). */
  gate?: RefObject<(change: () => void) => void>;
}) {
  const gate = opts.gate;
  const syncRef = useRef<PassSync | null>(null);
  // Plain canvases with no life of their own, so made once while rendering (the editor runs in the browser only).
  const [rasters] = useState(() => new PanelRasters(opts.spec));
  const strokesLayerRef = useRef<Konva.Layer>(null);
  const undoStack = useRef(new UndoStack());
  const [rooms, setRooms] = useState<Room[]>([]);
  const [lightboxes, setLightboxes] = useState<Lightbox[]>([]);
  const [strokeCount, setStrokeCount] = useState(0);
  const [seqSeen, setSeqSeen] = useState(0);
  const [loaded, setLoaded] = useState(false);
  const [status, setStatus] = useState<SyncStatus>({ state: 'saved', waiting: 0, message: null });
  const [undoState, setUndoState] = useState({ canUndo: false, canRedo: false });

  const redrawStrokes = useCallback(() => strokesLayerRef.current?.batchDraw(), []);

  // The sync lives as long as the editor of this pass (the page remounts the editor for
  // another pass): it takes the first props only, on purpose.
  const first = useRef(opts);
  useEffect(() => {
    const { passId, canDraw, pxPerMm } = first.current;
    const sync = new PassSync(passId, null, window.localStorage, !canDraw);
    syncRef.current = sync;
    const offDoc = sync.onDoc((change) => {
      // Strokes of the pass arriving: drawn on top, nothing else changes.
      if (change.added) {
        for (const s of change.added) rasters.drawStroke(s);
        strokesLayerRef.current?.batchDraw();
        setStrokeCount(sync.doc.strokes.size);
        return;
      }
      setLoaded(sync.loaded);
      if (change.full) rasters.redrawAll(sync.doc.strokes.values());
      else for (const p of change.panels) rasters.redrawPanel(p, strokesOfPanel(sync.doc, p));
      strokesLayerRef.current?.batchDraw();
      if (change.items) {
        setRooms([...sync.doc.rooms.values()]);
        setLightboxes([...sync.doc.lightboxes.values()]);
      }
      setStrokeCount(sync.doc.strokes.size);
      setSeqSeen(sync.seq);
    });
    const offStatus = sync.onStatus(setStatus);
    rasters.setScale(pxPerMm() * (window.devicePixelRatio || 1));
    sync.start();
    const flush = () => sync.flush();
    window.addEventListener('pagehide', flush);
    return () => {
      window.removeEventListener('pagehide', flush);
      sync.flush();
      offDoc();
      offStatus();
      sync.stop();
    };
  }, [rasters]);

  // Others' strokes: the page's live stream says when the pass has a new seq.
  const live = useLive();
  useEffect(() => syncRef.current?.setLive(live.connected), [live.connected]);
  useLiveEvents((e) => syncRef.current?.onLive(e));

  const refreshUndo = useCallback(() => setUndoState({ canUndo: undoStack.current.canUndo, canRedo: undoStack.current.canRedo }), []);

  /** Applies operations now and queues them; `undo` records them in the person's history. */
  const commit = useCallback(
    (ops: Op[], undo?: UndoEntry) => {
      const change = () => {
        syncRef.current?.commit(ops);
        if (undo) {
          undoStack.current.push(undo);
          refreshUndo();
        }
      };
      if (gate?.current) gate.current(change);
      else change();
    },
    [gate, refreshUndo],
  );

  /** A stroke under the pen just ended: into its panel's bitmap only, O(1) whatever the pass holds. */
  const commitDrawn = useCallback(
    (stroke: Stroke, undo: UndoEntry) => {
      const sync = syncRef.current;
      if (!sync) return;
      sync.commit([{ op: 'add', stroke }], { emit: false });
      rasters.drawStroke(stroke);
      redrawStrokes();
      setStrokeCount(sync.doc.strokes.size);
      undoStack.current.push(undo);
      refreshUndo();
      live.setPanel(stroke.panel);
    },
    [live, rasters, redrawStrokes, refreshUndo],
  );

  /** The eraser took strokes away: re-raster only their panels. */
  const commitErased = useCallback(
    (ops: Op[]) => {
      const sync = syncRef.current;
      if (!sync) return;
      const touched = sync.commit(ops, { emit: false });
      for (const p of touched) rasters.redrawPanel(p, strokesOfPanel(sync.doc, p));
      redrawStrokes();
      setStrokeCount(sync.doc.strokes.size);
    },
    [rasters, redrawStrokes],
  );

  const pushUndo = useCallback(
    (entry: UndoEntry) => {
      undoStack.current.push(entry);
      refreshUndo();
    },
    [refreshUndo],
  );

  const runUndo = useCallback(
    (which: 'undo' | 'redo') => {
      const change = () => {
        const ops = which === 'undo' ? undoStack.current.undo() : undoStack.current.redo();
        if (ops) syncRef.current?.commit(ops);
        refreshUndo();
      };
      if (gate?.current) gate.current(change);
      else change();
    },
    [gate, refreshUndo],
  );

  /** Re-rasters every panel at a new resolution (after a zoom settles). */
  const rescale = useCallback(
    (pxPerMm: number) => {
      const sync = syncRef.current;
      if (!sync) return;
      const ratio = pxPerMm / rasters.scale;
      if (ratio >= 0.8 && ratio <= 1.25) return;
      rasters.setScale(pxPerMm);
      rasters.redrawAll(sync.doc.strokes.values());
      redrawStrokes();
    },
    [rasters, redrawStrokes],
  );

  return {
    syncRef,
    rasters,
    strokesLayerRef,
    rooms,
    setRooms,
    lightboxes,
    strokeCount,
    loaded,
    seqSeen,
    status,
    undoState,
    commit,
    commitDrawn,
    commitErased,
    pushUndo,
    runUndo,
    rescale,
  };
}

export type PassSession = ReturnType<typeof usePassSession>;
