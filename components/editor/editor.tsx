'use client';
// The sketch editor of one pass. Drawing never redraws the whole pass:
// committed strokes live in one bitmap per panel (PanelRasters), the stroke
// under the pen is drawn on its own layer, and pan/zoom only moves the layers,
// re-rastering once when the gesture ends.
import type Konva from 'konva';
import { nanoid } from 'nanoid';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import useSWR from 'swr';
import { Circle, Ellipse, Group, Image as KImage, Layer, Rect, Shape, Stage, Text, Transformer } from 'react-konva';
import { CommentsPanel } from '@/components/review/comments-panel';
import { PresenceBar } from '@/components/review/presence-bar';
import { useLive, useLiveEvents } from '@/hooks/use-live';
import { useComments, useFindings } from '@/hooks/use-review';
import { type PageSpec, type Rect as MmRect, bleedBox, panelAt, panelRects, safeBox } from '@/lib/print/geometry';
import { type View, fitView, toPage, zoomAt } from '@/lib/print/view';
import { pointsBounds, rectsOverlap, strokeInLasso, strokeTouches } from '@/lib/strokes/hit';
import { outlineOf, traceOutline } from '@/lib/strokes/outline';
import { strokesOfPanel } from '@/lib/strokes/pass-model';
import { simplifyPoints } from '@/lib/strokes/simplify';
import { type Lightbox, type Op, type Point, type Room, type RoomShape, type Stroke, TONE_GREYS, greyToCss, strokeAlpha } from '@/lib/strokes/types';
import { centreAt, fitInto, scaleTo, turnQuarter, turned } from '@/lib/strokes/lightbox';
import { useUploadJobs } from '@/components/uploads/upload-jobs';
import type { UploadDto, UploadListItem } from '@/db/queries/uploads';
import { fetcher } from '@/lib/http/client';
import { BEAT_KINDS, BEAT_LABELS, type BeatKind } from '@/lib/gags/status';
import { PanelRasters } from './panel-rasters';
import { PassSync, type SyncStatus } from './pass-sync';
import { EditorToolbar, type Tool } from './toolbar';
import { HelpSheet } from './help-sheet';
import { RevisionsPanel } from './revisions-panel';
import { SyncBadge } from './sync-badge';
import { UndoStack, addedStrokes, lightboxChanged, lightboxRemoved, movedStrokes, removedStrokes, roomChanged, roomRemoved } from './undo';
import { LightboxPanel, type Target } from './lightbox-panel';
import { useLightboxImages } from './lightbox-images';

export type EditorProps = {
  passId: string;
  passNumber: number;
  gagId: string;
  seriesId: string;
  meId: string;
  passes: { id: string; number: number }[];
  canDraw: boolean;
  canComment: boolean;
  canRestore: boolean;
  spec: PageSpec;
  beats: { kind: BeatKind; note: string }[];
  initial: { seq: number; strokes: Stroke[]; rooms: Room[]; lightboxes: Lightbox[] };
};

export type Guides = { bleed: boolean; trim: boolean; safe: boolean; panels: boolean };

const PEN_SIZES = [0.3, 0.5, 0.8, 1.2, 2];
const TONE_SIZES = [3, 5, 8, 12];
const ERASER_RADIUS_PX = 10;

type Gesture =
  | { kind: 'draw'; pointerId: number; panel: number; points: Point[]; tool: 'pen' | 'tone' }
  | { kind: 'erase'; pointerId: number; removed: Stroke[] }
  | { kind: 'lasso'; pointerId: number; path: [number, number][] }
  | { kind: 'drag-selection'; pointerId: number; start: { x: number; y: number }; dx: number; dy: number; bounds: MmRect }
  | { kind: 'room'; pointerId: number; panel: number; start: { x: number; y: number }; end: { x: number; y: number } }
  | { kind: 'pan'; pointerId: number; last: { x: number; y: number } };

function clampToBox(p: { x: number; y: number }, b: MmRect) {
  return { x: Math.min(b.x + b.w, Math.max(b.x, p.x)), y: Math.min(b.y + b.h, Math.max(b.y, p.y)) };
}

function nearestPanel(spec: PageSpec, x: number, y: number): number {
  const at = panelAt(spec, x, y);
  if (at !== null) return at;
  let best = 0;
  let bestD = Infinity;
  panelRects(spec).forEach((r, i) => {
    const cx = Math.max(r.x, Math.min(x, r.x + r.w));
    const cy = Math.max(r.y, Math.min(y, r.y + r.h));
    const d = (cx - x) ** 2 + (cy - y) ** 2;
    if (d < bestD) {
      bestD = d;
      best = i;
    }
  });
  return best;
}

function unionBounds(strokes: Stroke[]): MmRect | null {
  if (strokes.length === 0) return null;
  return pointsBounds(strokes.flatMap((s) => s.points), Math.max(...strokes.map((s) => s.size)) / 2);
}

export default function Editor(props: EditorProps) {
  const { spec, canDraw } = props;
  const panels = useMemo(() => panelRects(spec), [spec]);
  const bleed = useMemo(() => bleedBox(spec), [spec]);
  const safe = useMemo(() => safeBox(spec), [spec]);

  const wrapRef = useRef<HTMLDivElement>(null);
  const stageRef = useRef<Konva.Stage>(null);
  const strokesLayerRef = useRef<Konva.Layer>(null);
  const overlayLayerRef = useRef<Konva.Layer>(null);
  const transformerRef = useRef<Konva.Transformer>(null);
  const roomNodes = useRef(new Map<string, Konva.Shape>());
  const lightboxTransformerRef = useRef<Konva.Transformer>(null);
  const lightboxNodes = useRef(new Map<string, Konva.Node>());

  const [size, setSize] = useState({ w: 800, h: 600 });
  const [view, setView] = useState<View>({ scale: 3, originX: 20, originY: 20 });
  const viewRef = useRef(view);
  viewRef.current = view;

  const [tool, setTool] = useState<Tool>(canDraw ? 'pen' : 'pan');
  const [penSize, setPenSize] = useState(0.5);
  const [toneSize, setToneSize] = useState(5);
  const [toneGrey, setToneGrey] = useState<number>(40);
  const [roomShape, setRoomShape] = useState<RoomShape>('ellipse');
  const [penOnly, setPenOnly] = useState(false);
  const [guides, setGuides] = useState<Guides>({ bleed: true, trim: true, safe: true, panels: true });
  const [selection, setSelection] = useState<string[]>([]);
  const [selectedRoom, setSelectedRoom] = useState<string | null>(null);
  const [rooms, setRooms] = useState<Room[]>(props.initial.rooms);
  const [lightboxes, setLightboxes] = useState<Lightbox[]>(props.initial.lightboxes);
  const [selectedLightbox, setSelectedLightbox] = useState<string | null>(null);
  /** A lightbox value shown while a slider moves, before it is committed. */
  const [lightboxPreview, setLightboxPreview] = useState<Lightbox | null>(null);
  const [dropOver, setDropOver] = useState(false);
  const { data: uploads, mutate: reloadUploads } = useSWR<UploadListItem[]>(`/api/series/${props.seriesId}/uploads`, fetcher);
  const images = useLightboxImages(lightboxes.map((l) => l.uploadId));
  const [strokeCount, setStrokeCount] = useState(props.initial.strokes.length);
  const [status, setStatus] = useState<SyncStatus>({ state: 'saved', waiting: 0, message: null });
  const [helpOpen, setHelpOpen] = useState(false);
  const [pointPin, setPointPin] = useState<{ panel: number; x: number; y: number } | null>(null);
  const [highlight, setHighlight] = useState(true);
  const [seqSeen, setSeqSeen] = useState(props.initial.seq);
  const { data: findings } = useFindings(props.passId, seqSeen);
  const { data: threads } = useComments(props.gagId);
  const flaggedRef = useRef(new Set<string>());
  flaggedRef.current = new Set(
    highlight && findings ? findings.panels.flatMap((p) => [...p.roomIntrusionIds, ...p.outsideSafeIds]) : [],
  );
  const pins = (threads ?? []).filter((t) => t.passId === props.passId && !t.resolvedAt && (t.target === 'panel' || t.target === 'point'));
  const [, setFrame] = useState(0);
  const [undoState, setUndoState] = useState({ canUndo: false, canRedo: false });

  const syncRef = useRef<PassSync | null>(null);
  const rastersRef = useRef<PanelRasters | null>(null);
  const gesture = useRef<Gesture | null>(null);
  const cursor = useRef<{ x: number; y: number } | null>(null);
  const touches = useRef(new Map<number, { x: number; y: number }>());
  const pinch = useRef<{ dist: number; mid: { x: number; y: number } } | null>(null);
  const undoStack = useRef(new UndoStack());
  const selectionRef = useRef(selection);
  selectionRef.current = selection;

  // ---------- set-up: sync, rasters, sizing ----------

  useEffect(() => {
    const rasters = new PanelRasters(spec);
    rastersRef.current = rasters;
    const sync = new PassSync(props.passId, props.initial, window.localStorage, !canDraw);
    syncRef.current = sync;
    const offDoc = sync.onDoc((change) => {
      const r = rastersRef.current;
      if (!r) return;
      if (change.full) r.redrawAll(sync.doc.strokes.values());
      else for (const p of change.panels) r.redrawPanel(p, strokesOfPanel(sync.doc, p));
      strokesLayerRef.current?.batchDraw();
      if (change.items) {
        setRooms([...sync.doc.rooms.values()]);
        setLightboxes([...sync.doc.lightboxes.values()]);
      }
      setStrokeCount(sync.doc.strokes.size);
      setSeqSeen(sync.seq);
      setSelection((sel) => sel.filter((id) => sync.doc.strokes.has(id)));
    });
    const offStatus = sync.onStatus(setStatus);
    const dpr = window.devicePixelRatio || 1;
    rasters.setScale(viewRef.current.scale * dpr);
    sync.start();
    setFrame((f) => f + 1);
    const flush = () => sync.flush();
    window.addEventListener('pagehide', flush);
    return () => {
      window.removeEventListener('pagehide', flush);
      sync.flush();
      offDoc();
      offStatus();
      sync.stop();
    };
    // The pass is fixed for the life of this component (the page remounts per pass).
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  // Others' strokes: the page's live stream says when the pass has a new seq.
  const live = useLive();
  useEffect(() => syncRef.current?.setLive(live.connected), [live.connected]);
  useLiveEvents((e) => syncRef.current?.onLive(e));

  useEffect(() => {
    const el = wrapRef.current;
    if (!el) return;
    let first = true;
    const ro = new ResizeObserver(([entry]) => {
      if (!entry) return;
      const w = Math.max(200, Math.floor(entry.contentRect.width));
      const h = Math.max(200, Math.floor(entry.contentRect.height));
      setSize({ w, h });
      if (first) {
        first = false;
        setView(fitView(bleed.x, bleed.y - 6, bleed.w, bleed.h + 14, w, h, 16));
      }
    });
    ro.observe(el);
    return () => ro.disconnect();
  }, [bleed]);

  // Re-raster once a zoom settles, only when the resolution is off by more than ~25%.
  useEffect(() => {
    const t = setTimeout(() => {
      const r = rastersRef.current;
      const sync = syncRef.current;
      if (!r || !sync) return;
      const want = view.scale * (window.devicePixelRatio || 1);
      const ratio = want / r.scale;
      if (ratio < 0.8 || ratio > 1.25) {
        r.setScale(want);
        r.redrawAll(sync.doc.strokes.values());
        strokesLayerRef.current?.batchDraw();
      }
    }, 180);
    return () => clearTimeout(t);
  }, [view.scale]);

  // ---------- committing operations ----------

  const refreshUndo = () => setUndoState({ canUndo: undoStack.current.canUndo, canRedo: undoStack.current.canRedo });

  const commit = useCallback((ops: Op[]) => {
    const sync = syncRef.current;
    if (!sync) return;
    sync.commit(ops);
  }, []);

  const runUndo = useCallback((which: 'undo' | 'redo') => {
    const ops = which === 'undo' ? undoStack.current.undo() : undoStack.current.redo();
    if (ops) commit(ops);
    refreshUndo();
  }, [commit]);

  // ---------- pointer handling ----------

  const localPoint = (e: PointerEvent | WheelEvent) => {
    const rect = wrapRef.current!.getBoundingClientRect();
    return { x: e.clientX - rect.left, y: e.clientY - rect.top };
  };

  const drawOverlay = () => overlayLayerRef.current?.batchDraw();

  const selectionStrokes = useCallback((): Stroke[] => {
    const doc = syncRef.current?.doc;
    if (!doc) return [];
    return selectionRef.current.map((id) => doc.strokes.get(id)).filter((s): s is Stroke => !!s);
  }, []);

  const eraseAt = useCallback((x: number, y: number, g: Extract<Gesture, { kind: 'erase' }>) => {
    const sync = syncRef.current;
    const rasters = rastersRef.current;
    if (!sync || !rasters) return;
    const radius = ERASER_RADIUS_PX / viewRef.current.scale;
    const probe = { x: x - radius, y: y - radius, w: 2 * radius, h: 2 * radius };
    const hits: Stroke[] = [];
    for (const s of sync.doc.strokes.values()) {
      if (!rectsOverlap(pointsBounds(s.points, s.size / 2), probe)) continue;
      if (strokeTouches(s.points, s.size, x, y, radius)) hits.push(s);
    }
    if (hits.length === 0) return;
    g.removed.push(...hits);
    const touched = sync.commit(hits.map((s) => ({ op: 'remove', strokeId: s.id })), { emit: false });
    for (const p of touched) rasters.redrawPanel(p, strokesOfPanel(sync.doc, p));
    strokesLayerRef.current?.batchDraw();
    setStrokeCount(sync.doc.strokes.size);
  }, []);

  useEffect(() => {
    const el = wrapRef.current;
    if (!el) return;

    const onDown = (e: PointerEvent) => {
      const pt = localPoint(e);
      const v = viewRef.current;
      const mm = toPage(v, pt.x, pt.y);
      if (e.pointerType === 'touch') {
        touches.current.set(e.pointerId, pt);
        if (touches.current.size === 2) {
          // Two fingers: pinch and pan; drop whatever one finger started.
          gesture.current = null;
          const [a, b] = [...touches.current.values()];
          pinch.current = { dist: Math.hypot(a!.x - b!.x, a!.y - b!.y), mid: { x: (a!.x + b!.x) / 2, y: (a!.y + b!.y) / 2 } };
          drawOverlay();
          return;
        }
        if (penOnly && tool !== 'pan') return; // a resting palm draws nothing
      }
      if (tool === 'pin' && e.button === 0) {
        const panel = nearestPanel(spec, mm.x, mm.y);
        const p = clampToBox(mm, panels[panel]!);
        setPointPin({ panel, x: Math.round(p.x * 10) / 10, y: Math.round(p.y * 10) / 10 });
        return;
      }
      if (tool === 'lightbox' && canDraw && e.button === 0) {
        const hit = stageRef.current?.getIntersection(pt);
        if (hit && (hit.name() === 'lightbox' || hit.getParent()?.className === 'Transformer')) return; // Konva drags it
        setSelectedLightbox(null);
        return;
      }
      if (e.button === 1 || tool === 'pan' || !canDraw) {
        gesture.current = { kind: 'pan', pointerId: e.pointerId, last: pt };
        el.setPointerCapture(e.pointerId);
        return;
      }
      if (e.button !== 0 && e.pointerType === 'mouse') return;
      const inBleed = clampToBox(mm, bleed);
      if (tool === 'pen' || tool === 'tone') {
        const pressure = e.pointerType === 'mouse' ? 0.5 : e.pressure || 0.5;
        gesture.current = { kind: 'draw', pointerId: e.pointerId, panel: nearestPanel(spec, inBleed.x, inBleed.y), points: [[inBleed.x, inBleed.y, pressure]], tool };
      } else if (tool === 'eraser') {
        const g: Gesture = { kind: 'erase', pointerId: e.pointerId, removed: [] };
        gesture.current = g;
        eraseAt(mm.x, mm.y, g);
      } else if (tool === 'lasso') {
        const sel = selectionStrokes();
        const b = unionBounds(sel);
        if (b && mm.x >= b.x && mm.x <= b.x + b.w && mm.y >= b.y && mm.y <= b.y + b.h) {
          gesture.current = { kind: 'drag-selection', pointerId: e.pointerId, start: mm, dx: 0, dy: 0, bounds: b };
        } else {
          gesture.current = { kind: 'lasso', pointerId: e.pointerId, path: [[mm.x, mm.y]] };
          setSelection([]);
        }
      } else if (tool === 'room') {
        const stage = stageRef.current;
        const hit = stage?.getIntersection(pt);
        if (hit && (hit.name() === 'room' || hit.getParent()?.className === 'Transformer')) return; // Konva handles it
        setSelectedRoom(null);
        const panel = nearestPanel(spec, mm.x, mm.y);
        const p = clampToBox(mm, panels[panel]!);
        gesture.current = { kind: 'room', pointerId: e.pointerId, panel, start: p, end: p };
      }
      el.setPointerCapture(e.pointerId);
      drawOverlay();
    };

    const onMove = (e: PointerEvent) => {
      const pt = localPoint(e);
      if (e.pointerType === 'touch' && touches.current.has(e.pointerId)) {
        touches.current.set(e.pointerId, pt);
        if (touches.current.size === 2 && pinch.current) {
          const [a, b] = [...touches.current.values()];
          const dist = Math.hypot(a!.x - b!.x, a!.y - b!.y);
          const mid = { x: (a!.x + b!.x) / 2, y: (a!.y + b!.y) / 2 };
          const prev = pinch.current;
          setView((v) => {
            const z = zoomAt(v, dist / Math.max(1, prev.dist), mid.x, mid.y);
            return { ...z, originX: z.originX + (mid.x - prev.mid.x), originY: z.originY + (mid.y - prev.mid.y) };
          });
          pinch.current = { dist, mid };
          return;
        }
      }
      const v = viewRef.current;
      const mm = toPage(v, pt.x, pt.y);
      cursor.current = mm;
      const g = gesture.current;
      if (!g || g.pointerId !== e.pointerId) {
        if (tool === 'eraser') drawOverlay();
        return;
      }
      switch (g.kind) {
        case 'pan':
          setView((cur) => ({ ...cur, originX: cur.originX + pt.x - g.last.x, originY: cur.originY + pt.y - g.last.y }));
          g.last = pt;
          return;
        case 'draw': {
          const events = typeof e.getCoalescedEvents === 'function' ? e.getCoalescedEvents() : [e];
          for (const ce of events.length ? events : [e]) {
            const p = clampToBox(toPage(v, ...(Object.values(localPoint(ce)) as [number, number])), bleed);
            const pressure = ce.pointerType === 'mouse' ? 0.5 : ce.pressure || 0.5;
            g.points.push([p.x, p.y, pressure]);
          }
          break;
        }
        case 'erase':
          eraseAt(mm.x, mm.y, g);
          break;
        case 'lasso':
          g.path.push([mm.x, mm.y]);
          break;
        case 'drag-selection': {
          // Keep the selection inside the bleed box.
          g.dx = Math.min(bleed.x + bleed.w - (g.bounds.x + g.bounds.w), Math.max(bleed.x - g.bounds.x, mm.x - g.start.x));
          g.dy = Math.min(bleed.y + bleed.h - (g.bounds.y + g.bounds.h), Math.max(bleed.y - g.bounds.y, mm.y - g.start.y));
          break;
        }
        case 'room':
          g.end = clampToBox(mm, panels[g.panel]!);
          break;
      }
      drawOverlay();
    };

    const finish = (e: PointerEvent) => {
      if (e.pointerType === 'touch') {
        touches.current.delete(e.pointerId);
        if (touches.current.size < 2) pinch.current = null;
      }
      const g = gesture.current;
      if (!g || g.pointerId !== e.pointerId) return;
      gesture.current = null;
      const sync = syncRef.current;
      const rasters = rastersRef.current;
      if (!sync || !rasters) return;
      switch (g.kind) {
        case 'draw': {
          const points = simplifyPoints(g.points, 0.02);
          const stroke: Stroke = {
            id: nanoid(),
            panel: g.panel,
            tool: g.tool,
            grey: g.tool === 'tone' ? toneGrey : 100,
            size: g.tool === 'tone' ? toneSize : penSize,
            points,
          };
          // O(1): draw into the panel's bitmap; no redraw of the other strokes.
          sync.commit([{ op: 'add', stroke }], { emit: false });
          live.setPanel(stroke.panel);
          rasters.drawStroke(stroke);
          strokesLayerRef.current?.batchDraw();
          setStrokeCount(sync.doc.strokes.size);
          undoStack.current.push(addedStrokes([stroke]));
          break;
        }
        case 'erase':
          if (g.removed.length) undoStack.current.push(removedStrokes(g.removed));
          break;
        case 'lasso': {
          const picked: string[] = [];
          if (g.path.length > 2) for (const s of sync.doc.strokes.values()) if (strokeInLasso(s.points, g.path)) picked.push(s.id);
          setSelection(picked);
          break;
        }
        case 'drag-selection':
          if (Math.abs(g.dx) > 1e-3 || Math.abs(g.dy) > 1e-3) {
            const ids = selectionRef.current;
            const dx = Math.round(g.dx * 100) / 100;
            const dy = Math.round(g.dy * 100) / 100;
            commit([{ op: 'move', strokeIds: ids, dx, dy }]);
            undoStack.current.push(movedStrokes(ids, dx, dy));
          }
          break;
        case 'room': {
          const x = Math.min(g.start.x, g.end.x);
          const y = Math.min(g.start.y, g.end.y);
          const w = Math.abs(g.end.x - g.start.x);
          const h = Math.abs(g.end.y - g.start.y);
          if (w > 2 && h > 2) {
            const room: Room = { id: nanoid(), panel: g.panel, shape: roomShape, x, y, w, h };
            commit([{ op: 'room', room }]);
            undoStack.current.push(roomChanged(null, room));
            setSelectedRoom(room.id);
          }
          break;
        }
        case 'pan':
          break;
      }
      refreshUndo();
      drawOverlay();
    };

    const onWheel = (e: WheelEvent) => {
      e.preventDefault();
      const pt = localPoint(e);
      if (e.shiftKey || e.altKey) {
        setView((v) => ({ ...v, originX: v.originX - (e.shiftKey ? e.deltaY : e.deltaX), originY: v.originY - (e.shiftKey ? 0 : e.deltaY) }));
      } else {
        setView((v) => zoomAt(v, Math.exp(-e.deltaY * 0.0015), pt.x, pt.y));
      }
    };
    const onLeave = () => {
      cursor.current = null;
      drawOverlay();
    };

    el.addEventListener('pointerdown', onDown);
    el.addEventListener('pointermove', onMove);
    el.addEventListener('pointerup', finish);
    el.addEventListener('pointercancel', finish);
    el.addEventListener('pointerleave', onLeave);
    el.addEventListener('wheel', onWheel, { passive: false });
    return () => {
      el.removeEventListener('pointerdown', onDown);
      el.removeEventListener('pointermove', onMove);
      el.removeEventListener('pointerup', finish);
      el.removeEventListener('pointercancel', finish);
      el.removeEventListener('pointerleave', onLeave);
      el.removeEventListener('wheel', onWheel);
    };
  }, [tool, penOnly, canDraw, bleed, panels, spec, penSize, toneSize, toneGrey, roomShape, commit, eraseAt, selectionStrokes]);

  // ---------- lightbox ----------

  const areaOf = useCallback((t: Target) => (t === null ? bleed : panels[t]!), [bleed, panels]);
  const uploadsById = useMemo(() => new Map((uploads ?? []).map((u) => [u.id, u])), [uploads]);

  const changeLightbox = useCallback((before: Lightbox | null, after: Lightbox) => {
    commit([{ op: 'lightbox', lightbox: after }]);
    undoStack.current.push(lightboxChanged(before, after));
    refreshUndo();
    setLightboxPreview(null);
  }, [commit]);

  const removeLightbox = useCallback((l: Lightbox) => {
    commit([{ op: 'unlightbox', lightboxId: l.id }]);
    undoStack.current.push(lightboxRemoved(l));
    refreshUndo();
    setSelectedLightbox(null);
  }, [commit]);

  const placeLightbox = useCallback((upload: Pick<UploadDto, 'id' | 'width' | 'height'>, target: Target) => {
    const l: Lightbox = { id: nanoid(), uploadId: upload.id, panel: target, ...fitInto(areaOf(target), upload, 0), rotation: 0, opacity: 0.5, visible: true };
    changeLightbox(null, l);
    setSelectedLightbox(l.id);
  }, [areaOf, changeLightbox]);

  /** Width of the box that fits the lightbox's image into its target, for the size slider. */
  const fitWidthOf = useCallback((l: Lightbox) => {
    const u = uploadsById.get(l.uploadId);
    const image = u ?? (turned(l.rotation) ? { width: l.h, height: l.w } : { width: l.w, height: l.h });
    return fitInto(areaOf(l.panel), image, l.rotation).w;
  }, [areaOf, uploadsById]);

  const lightboxEdited = useCallback((id: string, node: Konva.Node) => {
    const before = syncRef.current?.doc.lightboxes.get(id);
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
    changeLightbox(before, centreAt(scaled, cx, cy));
  }, [areaOf, changeLightbox]);

  const dropTarget = useRef<Target>(null);
  const { jobs: uploadJobs, start: startUploadJobs } = useUploadJobs(
    props.seriesId,
    useCallback((u: UploadDto, index: number) => {
      void reloadUploads();
      if (index === 0) placeLightbox(u, dropTarget.current);
    }, [placeLightbox, reloadUploads]),
  );
  const startUpload = useCallback((files: FileList | File[], target: Target) => {
    dropTarget.current = target;
    startUploadJobs(files);
  }, [startUploadJobs]);

  useEffect(() => {
    const tr = lightboxTransformerRef.current;
    if (!tr) return;
    const node = selectedLightbox ? lightboxNodes.current.get(selectedLightbox) : undefined;
    tr.nodes(node && tool === 'lightbox' && canDraw ? [node] : []);
    tr.getLayer()?.batchDraw();
  }, [selectedLightbox, lightboxes, tool, canDraw, images]);

  // ---------- selection and room actions ----------

  const deleteSelection = useCallback(() => {
    const sync = syncRef.current;
    if (!sync) return;
    if (selectedLightbox && tool === 'lightbox') {
      const l = sync.doc.lightboxes.get(selectedLightbox);
      if (l) removeLightbox(l);
      return;
    }
    if (selectedRoom && tool === 'room') {
      const room = sync.doc.rooms.get(selectedRoom);
      if (room) {
        commit([{ op: 'unroom', roomId: room.id }]);
        undoStack.current.push(roomRemoved(room));
      }
      setSelectedRoom(null);
    } else {
      const strokes = selectionStrokes();
      if (strokes.length) {
        commit(strokes.map((s) => ({ op: 'remove', strokeId: s.id })));
        undoStack.current.push(removedStrokes(strokes));
      }
      setSelection([]);
    }
    refreshUndo();
  }, [commit, removeLightbox, selectedLightbox, selectedRoom, selectionStrokes, tool]);

  const copySelectionTo = useCallback((target: number) => {
    const strokes = selectionStrokes();
    if (!strokes.length) return;
    const to = panels[target]!;
    const copies: Stroke[] = strokes.map((s) => {
      const from = panels[s.panel]!;
      const dx = to.x - from.x;
      const dy = to.y - from.y;
      return { ...s, id: nanoid(), panel: target, points: s.points.map(([x, y, p]) => [Math.round((x + dx) * 100) / 100, Math.round((y + dy) * 100) / 100, p] as Point) };
    });
    commit(copies.map((stroke) => ({ op: 'add', stroke })));
    undoStack.current.push(addedStrokes(copies));
    setSelection(copies.map((c) => c.id));
    refreshUndo();
  }, [commit, panels, selectionStrokes]);

  const roomEdited = useCallback((id: string, node: Konva.Shape) => {
    const sync = syncRef.current;
    const before = sync?.doc.rooms.get(id);
    if (!sync || !before) return;
    const sx = node.scaleX();
    const sy = node.scaleY();
    node.scale({ x: 1, y: 1 });
    let w: number;
    let h: number;
    let x: number;
    let y: number;
    if (before.shape === 'ellipse') {
      w = (node as Konva.Ellipse).radiusX() * 2 * sx;
      h = (node as Konva.Ellipse).radiusY() * 2 * sy;
      x = node.x() - w / 2;
      y = node.y() - h / 2;
    } else {
      w = node.width() * sx;
      h = node.height() * sy;
      x = node.x();
      y = node.y();
    }
    const p = panels[before.panel]!;
    x = Math.max(p.x, Math.min(x, p.x + p.w - 2));
    y = Math.max(p.y, Math.min(y, p.y + p.h - 2));
    w = Math.max(2, Math.min(w, p.x + p.w - x));
    h = Math.max(2, Math.min(h, p.y + p.h - y));
    const r2 = (n: number) => Math.round(n * 100) / 100;
    const after: Room = { ...before, x: r2(x), y: r2(y), w: r2(w), h: r2(h) };
    commit([{ op: 'room', room: after }]);
    undoStack.current.push(roomChanged(before, after));
    refreshUndo();
    setRooms([...sync.doc.rooms.values()]);
  }, [commit, panels]);

  useEffect(() => {
    const tr = transformerRef.current;
    if (!tr) return;
    const node = selectedRoom ? roomNodes.current.get(selectedRoom) : undefined;
    tr.nodes(node && tool === 'room' ? [node] : []);
    tr.getLayer()?.batchDraw();
  }, [selectedRoom, rooms, tool]);

  useEffect(() => {
    if (tool !== 'room') setSelectedRoom(null);
    if (tool !== 'lightbox') setSelectedLightbox(null);
    if (tool !== 'lasso') setSelection([]);
  }, [tool]);

  useEffect(() => {
    overlayLayerRef.current?.batchDraw();
  }, [findings, highlight]);

  // ---------- keyboard ----------

  const fit = useCallback(() => setView(fitView(bleed.x, bleed.y - 6, bleed.w, bleed.h + 14, size.w, size.h, 16)), [bleed, size]);

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const t = e.target as HTMLElement | null;
      if (t && (t.tagName === 'INPUT' || t.tagName === 'TEXTAREA' || t.tagName === 'SELECT' || t.isContentEditable)) return;
      const mod = e.ctrlKey || e.metaKey;
      if (mod && e.key.toLowerCase() === 'z') {
        e.preventDefault();
        if (canDraw) runUndo(e.shiftKey ? 'redo' : 'undo');
        return;
      }
      if (mod && e.key.toLowerCase() === 'y') {
        e.preventDefault();
        if (canDraw) runUndo('redo');
        return;
      }
      if (mod) return;
      const tools: Tool[] = ['pen', 'tone', 'eraser', 'lasso', 'room', 'pan', 'pin', 'lightbox'];
      const n = Number(e.key);
      if (n >= 1 && n <= tools.length && e.key.length === 1) {
        const t = tools[n - 1]!;
        if (t === 'pan' || (t === 'pin' ? props.canComment : canDraw)) setTool(t);
        return;
      }
      const pan = 40;
      // Arranging a chosen lightbox, the arrow keys nudge it: 1 mm, or 10 mm with Shift.
      const nudge = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, -1], ArrowDown: [0, 1] }[e.key];
      if (nudge && tool === 'lightbox' && canDraw && selectedLightbox) {
        e.preventDefault();
        const l = syncRef.current?.doc.lightboxes.get(selectedLightbox);
        if (!l) return;
        const step = e.shiftKey ? 10 : 1;
        const area = areaOf(l.panel);
        const cx = Math.min(area.x + area.w, Math.max(area.x, l.x + l.w / 2 + nudge[0]! * step));
        const cy = Math.min(area.y + area.h, Math.max(area.y, l.y + l.h / 2 + nudge[1]! * step));
        changeLightbox(l, centreAt(l, cx, cy));
        return;
      }
      switch (e.key) {
        case '+':
        case '=':
          setView((v) => zoomAt(v, 1.25, size.w / 2, size.h / 2));
          break;
        case '-':
        case '_':
          setView((v) => zoomAt(v, 0.8, size.w / 2, size.h / 2));
          break;
        case '0':
          fit();
          break;
        case 'ArrowLeft':
          setView((v) => ({ ...v, originX: v.originX + pan }));
          break;
        case 'ArrowRight':
          setView((v) => ({ ...v, originX: v.originX - pan }));
          break;
        case 'ArrowUp':
          setView((v) => ({ ...v, originY: v.originY + pan }));
          break;
        case 'ArrowDown':
          setView((v) => ({ ...v, originY: v.originY - pan }));
          break;
        case '[':
          if (tool === 'tone') setToneSize((s) => TONE_SIZES[Math.max(0, TONE_SIZES.indexOf(s) - 1)] ?? s);
          else setPenSize((s) => PEN_SIZES[Math.max(0, PEN_SIZES.indexOf(s) - 1)] ?? s);
          break;
        case ']':
          if (tool === 'tone') setToneSize((s) => TONE_SIZES[Math.min(TONE_SIZES.length - 1, TONE_SIZES.indexOf(s) + 1)] ?? s);
          else setPenSize((s) => PEN_SIZES[Math.min(PEN_SIZES.length - 1, PEN_SIZES.indexOf(s) + 1)] ?? s);
          break;
        case ',':
          setToneGrey((g) => TONE_GREYS[Math.max(0, TONE_GREYS.indexOf(g as (typeof TONE_GREYS)[number]) - 1)] ?? g);
          break;
        case '.':
          setToneGrey((g) => TONE_GREYS[Math.min(TONE_GREYS.length - 1, TONE_GREYS.indexOf(g as (typeof TONE_GREYS)[number]) + 1)] ?? g);
          break;
        case 'Delete':
        case 'Backspace':
          if (canDraw) deleteSelection();
          break;
        case 'Escape':
          setSelection([]);
          setSelectedRoom(null);
          setSelectedLightbox(null);
          setHelpOpen(false);
          break;
        case 'p':
        case 'P':
          setPenOnly((v) => !v);
          break;
        case 'g':
        case 'G':
          setGuides((g) => {
            const on = !(g.bleed || g.trim || g.safe || g.panels);
            return { bleed: on, trim: on, safe: on, panels: on };
          });
          break;
        case '?':
          setHelpOpen((o) => !o);
          break;
        default:
          return;
      }
      e.preventDefault();
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [areaOf, canDraw, changeLightbox, deleteSelection, fit, runUndo, selectedLightbox, size, tool, props.canComment]);

  // ---------- drawing the overlay (live stroke, lasso, selection, eraser) ----------

  const drawLive = (ctx: Konva.Context) => {
    const c = ctx._context as CanvasRenderingContext2D;
    const g = gesture.current;
    const v = viewRef.current;
    const px = 1 / v.scale; // one screen pixel, in mm
    if (g?.kind === 'draw' && g.points.length) {
      const r = panels[g.panel]!;
      const isTone = g.tool === 'tone';
      c.save();
      c.beginPath();
      c.rect(r.x, r.y, r.w, r.h);
      c.clip();
      c.beginPath();
      traceOutline(c, outlineOf({ tool: g.tool, size: isTone ? toneSize : penSize, points: g.points }, false));
      c.globalAlpha = strokeAlpha(g.tool);
      c.fillStyle = greyToCss(isTone ? toneGrey : 100);
      c.fill();
      c.restore();
    }
    if (g?.kind === 'lasso' && g.path.length > 1) {
      c.save();
      c.beginPath();
      g.path.forEach(([x, y], i) => (i ? c.lineTo(x, y) : c.moveTo(x, y)));
      c.closePath();
      c.fillStyle = 'rgba(29,78,110,0.08)';
      c.fill();
      c.setLineDash([4 * px, 3 * px]);
      c.lineWidth = px;
      c.strokeStyle = '#1d4e6e';
      c.stroke();
      c.restore();
    }
    if (g?.kind === 'room') {
      c.save();
      c.setLineDash([4 * px, 3 * px]);
      c.lineWidth = 1.5 * px;
      c.strokeStyle = '#1d4e6e';
      c.strokeRect(Math.min(g.start.x, g.end.x), Math.min(g.start.y, g.end.y), Math.abs(g.end.x - g.start.x), Math.abs(g.end.y - g.start.y));
      c.restore();
    }
    const sel = selectionStrokes();
    if (sel.length) {
      const dx = g?.kind === 'drag-selection' ? g.dx : 0;
      const dy = g?.kind === 'drag-selection' ? g.dy : 0;
      c.save();
      c.translate(dx, dy);
      c.fillStyle = 'rgba(29,78,110,0.55)';
      const r = rastersRef.current;
      for (const s of sel) if (r) c.fill(r.pathOf(s));
      const b = unionBounds(sel)!;
      c.setLineDash([5 * px, 4 * px]);
      c.lineWidth = px;
      c.strokeStyle = '#1d4e6e';
      c.strokeRect(b.x, b.y, b.w, b.h);
      c.restore();
    }
    if (flaggedRef.current.size) {
      const doc = syncRef.current?.doc;
      const r = rastersRef.current;
      c.save();
      c.strokeStyle = '#b8321f';
      c.lineWidth = 2 * px;
      for (const id of flaggedRef.current) {
        const s = doc?.strokes.get(id);
        if (s && r) c.stroke(r.pathOf(s));
      }
      c.restore();
    }
    if (tool === 'eraser' && cursor.current) {
      c.save();
      c.beginPath();
      c.arc(cursor.current.x, cursor.current.y, ERASER_RADIUS_PX * px, 0, Math.PI * 2);
      c.lineWidth = px;
      c.strokeStyle = '#b8321f';
      c.stroke();
      c.restore();
    }
  };

  // ---------- render ----------

  const layerProps = { x: view.originX, y: view.originY, scaleX: view.scale, scaleY: view.scale };
  const rasters = rastersRef.current;
  const hair = { strokeScaleEnabled: false, listening: false } as const;
  const notes = Object.fromEntries(props.beats.map((b) => [b.kind, b.note])) as Record<BeatKind, string>;

  return (
    <div className="flex h-[calc(100vh-8.5rem)] min-h-[520px] flex-col gap-2 lg:flex-row">
      <EditorToolbar
        canDraw={canDraw}
        canComment={props.canComment}
        tool={tool}
        setTool={setTool}
        penSize={penSize}
        setPenSize={setPenSize}
        penSizes={PEN_SIZES}
        toneSize={toneSize}
        setToneSize={setToneSize}
        toneSizes={TONE_SIZES}
        toneGrey={toneGrey}
        setToneGrey={setToneGrey}
        roomShape={roomShape}
        setRoomShape={setRoomShape}
        penOnly={penOnly}
        setPenOnly={setPenOnly}
        guides={guides}
        setGuides={setGuides}
        onUndo={() => runUndo('undo')}
        onRedo={() => runUndo('redo')}
        canUndo={undoState.canUndo}
        canRedo={undoState.canRedo}
        zoomIn={() => setView((v) => zoomAt(v, 1.25, size.w / 2, size.h / 2))}
        zoomOut={() => setView((v) => zoomAt(v, 0.8, size.w / 2, size.h / 2))}
        fit={fit}
        openHelp={() => setHelpOpen(true)}
      />
      <div className="relative min-h-0 min-w-0 flex-1">
        <div className="absolute bottom-2 left-2 z-10 flex flex-wrap items-center gap-2">
          <SyncBadge status={status} readOnly={!canDraw} />
          {selection.length > 0 && canDraw && (
            <div className="panel flex flex-wrap items-center gap-1 px-2 py-1 text-sm" role="group" aria-label="Selection">
              <span className="font-bold">{selection.length} selected</span>
              <button type="button" className="rounded px-2 py-0.5 hover:bg-paper-deep" onClick={deleteSelection}>
                Delete
              </button>
              <span className="text-graphite-faint">Copy to:</span>
              {BEAT_KINDS.map((k, i) => (
                <button key={k} type="button" className="rounded px-2 py-0.5 hover:bg-paper-deep" onClick={() => copySelectionTo(i)}>
                  {i + 1} {BEAT_LABELS[k]}
                </button>
              ))}
              <button type="button" className="rounded px-2 py-0.5 hover:bg-paper-deep" onClick={() => setSelection([])}>
                Done
              </button>
            </div>
          )}
          {selectedRoom && tool === 'room' && canDraw && (
            <div className="panel flex items-center gap-1 px-2 py-1 text-sm" role="group" aria-label="Balloon room">
              <span className="font-bold">Balloon room</span>
              <button type="button" className="rounded px-2 py-0.5 hover:bg-paper-deep" onClick={deleteSelection}>
                Delete room
              </button>
            </div>
          )}
        </div>
        <div
          ref={wrapRef}
          role="application"
          aria-label={`Sketch canvas, pass ${props.passNumber}. ${canDraw ? 'Draw with a pen, mouse or finger.' : 'Read-only.'} Press ? for shortcuts.`}
          data-testid="sketch-canvas"
          data-stroke-count={strokeCount}
          data-room-count={rooms.length}
          data-lightbox-count={lightboxes.filter((l) => l.visible).length}
          data-lightbox-images={lightboxes.filter((l) => l.visible && images.get(l.uploadId) instanceof HTMLImageElement).length}
          data-tool={tool}
          tabIndex={0}
          className={`h-full w-full touch-none overflow-hidden rounded-lg border bg-marker-10 ${dropOver ? 'border-ink ring-2 ring-ink' : 'border-paper-edge'}`}
          onDragOver={(e) => {
            if (!canDraw || !e.dataTransfer.types.includes('Files')) return;
            e.preventDefault();
            setDropOver(true);
          }}
          onDragLeave={() => setDropOver(false)}
          onDrop={(e) => {
            if (!canDraw || !e.dataTransfer.files.length) return;
            e.preventDefault();
            setDropOver(false);
            const rect = wrapRef.current!.getBoundingClientRect();
            const mm = toPage(viewRef.current, e.clientX - rect.left, e.clientY - rect.top);
            startUpload(e.dataTransfer.files, panelAt(spec, mm.x, mm.y));
          }}
          style={{ cursor: tool === 'pan' || !canDraw ? 'grab' : 'crosshair' }}
        >
          <Stage ref={stageRef} width={size.w} height={size.h}>
            <Layer listening={false} {...layerProps}>
              <Rect x={bleed.x} y={bleed.y} width={bleed.w} height={bleed.h} fill="#ffffff" shadowColor="#2a2a2d" shadowOpacity={0.15} shadowBlur={8} />
              {guides.bleed && (
                <>
                  <Rect x={bleed.x} y={bleed.y} width={bleed.w} height={spec.bleed} fill="#b8321f" opacity={0.06} />
                  <Rect x={bleed.x} y={spec.trimH} width={bleed.w} height={spec.bleed} fill="#b8321f" opacity={0.06} />
                  <Rect x={bleed.x} y={0} width={spec.bleed} height={spec.trimH} fill="#b8321f" opacity={0.06} />
                  <Rect x={spec.trimW} y={0} width={spec.bleed} height={spec.trimH} fill="#b8321f" opacity={0.06} />
                </>
              )}
              {guides.panels && panels.map((r, i) => <Rect key={i} x={r.x} y={r.y} width={r.w} height={r.h} stroke="#b4b1aa" strokeWidth={1} {...hair} />)}
              {panels.map((r, i) => {
                const kind = BEAT_KINDS[i]!;
                const top = i < 2;
                return (
                  <Text
                    key={kind}
                    x={r.x}
                    y={top ? bleed.y - 5 : bleed.y + bleed.h + 1.2}
                    width={r.w}
                    text={`${i + 1} ${BEAT_LABELS[kind]}${notes[kind] ? ` — ${notes[kind]}` : ''}`}
                    fontSize={2.6}
                    fill="#4a4a50"
                    wrap="none"
                    ellipsis
                  />
                );
              })}
            </Layer>
            <Layer listening={tool === 'lightbox' && canDraw} {...layerProps}>
              {lightboxes.map((saved) => {
                const l = lightboxPreview?.id === saved.id ? lightboxPreview : saved;
                if (!l.visible) return null;
                const area = areaOf(l.panel);
                const img = images.get(l.uploadId);
                const iw = turned(l.rotation) ? l.h : l.w;
                const ih = turned(l.rotation) ? l.w : l.h;
                const arrange = tool === 'lightbox' && canDraw;
                const common = {
                  name: 'lightbox',
                  x: l.x + l.w / 2,
                  y: l.y + l.h / 2,
                  offsetX: iw / 2,
                  offsetY: ih / 2,
                  width: iw,
                  height: ih,
                  rotation: l.rotation,
                  draggable: arrange,
                  onPointerDown: () => setSelectedLightbox(l.id),
                  onDragEnd: (e: Konva.KonvaEventObject<DragEvent>) => lightboxEdited(l.id, e.target),
                  onTransformEnd: (e: Konva.KonvaEventObject<Event>) => lightboxEdited(l.id, e.target),
                  ref: (node: Konva.Node | null) => {
                    if (node) lightboxNodes.current.set(l.id, node);
                    else lightboxNodes.current.delete(l.id);
                  },
                };
                const key = `${l.id}-${l.x}-${l.y}-${l.w}-${l.h}-${l.rotation}`;
                return (
                  <Group key={l.id} clipX={area.x} clipY={area.y} clipWidth={area.w} clipHeight={area.h}>
                    {img === 'missing' ? (
                      <Rect key={key} {...common} stroke="#b8321f" strokeWidth={1} strokeScaleEnabled={false} dash={[6, 4]} fill="rgba(184,50,31,0.04)" />
                    ) : img ? (
                      <KImage key={key} {...common} image={img} opacity={l.opacity} />
                    ) : (
                      <Rect key={key} {...common} fill="#ebe7df" opacity={l.opacity} />
                    )}
                  </Group>
                );
              })}
              <Transformer ref={lightboxTransformerRef} rotateEnabled={false} keepRatio enabledAnchors={['top-left', 'top-right', 'bottom-left', 'bottom-right']} ignoreStroke />
            </Layer>
            <Layer ref={strokesLayerRef} listening={false} {...layerProps}>
              {rasters && panels.map((r, i) => <KImage key={i} image={rasters.canvases[i]} x={r.x} y={r.y} width={r.w} height={r.h} />)}
            </Layer>
            <Layer ref={overlayLayerRef} {...layerProps}>
              {guides.trim && <Rect x={0} y={0} width={spec.trimW} height={spec.trimH} stroke="#b8321f" strokeWidth={1} {...hair} />}
              {guides.safe && <Rect x={safe.x} y={safe.y} width={safe.w} height={safe.h} stroke="#1d4e6e" strokeWidth={1} dash={[4, 3]} {...hair} />}
              {rooms.map((room) => {
                const common = {
                  name: 'room',
                  fill: 'rgba(219,232,240,0.55)',
                  stroke: '#1d4e6e',
                  strokeWidth: 1.5,
                  strokeScaleEnabled: false,
                  dash: [5, 3],
                  listening: tool === 'room' && canDraw,
                  draggable: tool === 'room' && canDraw,
                  onPointerDown: () => setSelectedRoom(room.id),
                  onDragEnd: (e: Konva.KonvaEventObject<DragEvent>) => roomEdited(room.id, e.target as Konva.Shape),
                  onTransformEnd: (e: Konva.KonvaEventObject<Event>) => roomEdited(room.id, e.target as Konva.Shape),
                  ref: (node: Konva.Shape | null) => {
                    if (node) roomNodes.current.set(room.id, node);
                    else roomNodes.current.delete(room.id);
                  },
                };
                return room.shape === 'ellipse' ? (
                  <Ellipse key={`${room.id}-${room.x}-${room.y}-${room.w}-${room.h}`} x={room.x + room.w / 2} y={room.y + room.h / 2} radiusX={room.w / 2} radiusY={room.h / 2} {...common} />
                ) : (
                  <Rect key={`${room.id}-${room.x}-${room.y}-${room.w}-${room.h}`} x={room.x} y={room.y} width={room.w} height={room.h} cornerRadius={1} {...common} />
                );
              })}
              {pins.map((t, i) => {
                const r = panels[t.panel ?? 0]!;
                const x = t.target === 'point' && t.x !== null ? t.x : r.x + 3;
                const y = t.target === 'point' && t.y !== null ? t.y : r.y + 3;
                const rad = 9 / view.scale;
                return (
                  <Group key={t.id} x={x} y={y} listening={false} name="comment-pin">
                    <Circle radius={rad} fill="#1d4e6e" stroke="#ffffff" strokeWidth={1.5} strokeScaleEnabled={false} />
                    <Text text={String(i + 1)} fontSize={11 / view.scale} fill="#ffffff" width={2 * rad} height={2 * rad} offsetX={rad} offsetY={rad} align="center" verticalAlign="middle" fontStyle="bold" />
                  </Group>
                );
              })}
              {pointPin && (
                <Circle x={pointPin.x} y={pointPin.y} radius={6 / view.scale} fill="#b8321f" stroke="#ffffff" strokeWidth={1.5} strokeScaleEnabled={false} listening={false} />
              )}
              <Transformer ref={transformerRef} rotateEnabled={false} ignoreStroke keepRatio={false} />
              <Shape sceneFunc={drawLive} listening={false} />
            </Layer>
          </Stage>
        </div>
      </div>
      <aside className="flex w-full shrink-0 flex-col gap-3 overflow-y-auto lg:w-80" aria-label="Beats, review and revisions">
        <div className="panel px-3 py-2">
          <PresenceBar gagId={props.gagId} where={`pass:${props.passNumber}`} meId={props.meId} />
        </div>
        {findings && (
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
                  {p.panel + 1} {BEAT_LABELS[BEAT_KINDS[p.panel]!]}: ink {Math.round(p.inkLoad * 100)}%
                  {p.inkHeavy ? ' (heavy)' : ''}
                  {p.roomIntrusions ? ` · ${p.roomIntrusions} in balloon room` : ''}
                  {p.outsideSafe ? ` · ${p.outsideSafe} past safe area` : ''}
                  {p.empty ? ' · empty' : ''}
                </li>
              ))}
            </ul>
            {findings.beatsMissing.length > 0 && <p className="mt-1 text-stamp">No note: {findings.beatsMissing.map((k) => BEAT_LABELS[k]).join(', ')}</p>}
          </section>
        )}
        <LightboxPanel
          lightboxes={lightboxes}
          uploads={uploads ?? []}
          canDraw={canDraw}
          selectedId={selectedLightbox}
          fitWidthOf={fitWidthOf}
          jobs={uploadJobs}
          startUpload={startUpload}
          onSelect={(id) => {
            setSelectedLightbox(id);
            if (canDraw) setTool('lightbox');
          }}
          onPlace={(uploadId, target) => {
            const u = uploadsById.get(uploadId);
            if (u) placeLightbox(u, target);
          }}
          onChange={changeLightbox}
          onPreview={setLightboxPreview}
          onTurn={(l) => changeLightbox(l, turnQuarter(l))}
          onFit={(l) => {
            const u = uploadsById.get(l.uploadId);
            if (u) changeLightbox(l, { ...l, ...fitInto(areaOf(l.panel), u, l.rotation) });
          }}
          onScale={(l, width) => changeLightbox(l, scaleTo(l, width))}
          onRemove={removeLightbox}
        />
        <section className="panel p-3">
          <h2 className="mb-2 font-display text-lg font-extrabold">Beats</h2>
          <ol className="space-y-2 text-sm">
            {BEAT_KINDS.map((k, i) => (
              <li key={k}>
                <span className="font-bold">
                  {i + 1} {BEAT_LABELS[k]}
                </span>
                <p className="text-graphite-soft">{notes[k] || <em className="text-graphite-faint">No note yet.</em>}</p>
              </li>
            ))}
          </ol>
        </section>
        {pointPin && props.canComment && (
          <p className="panel px-3 py-2 text-sm">
            New pin at panel {pointPin.panel + 1}, {pointPin.x} × {pointPin.y} mm: choose “Pinned point” below and write.{' '}
            <button type="button" className="text-ink underline" onClick={() => setPointPin(null)}>
              Drop pin
            </button>
          </p>
        )}
        <CommentsPanel
          gagId={props.gagId}
          seriesId={props.seriesId}
          meId={props.meId}
          canComment={props.canComment}
          passes={props.passes}
          onlyPassId={props.passId}
          point={pointPin ? { passId: props.passId, ...pointPin } : undefined}
          onPosted={() => setPointPin(null)}
        />
        <RevisionsPanel passId={props.passId} canRestore={props.canRestore} onRestored={() => void syncRef.current?.resync()} />
      </aside>
      <HelpSheet open={helpOpen} onClose={() => setHelpOpen(false)} />
    </div>
  );
}
