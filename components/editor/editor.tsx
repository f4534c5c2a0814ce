'use client';
// The sketch editor of one pass, put together from its parts:
// - use-pass-session: the sync (outbox, batches, live catch-up), the panel bitmaps, undo
// - gestures + use-pointer-gestures: what the pen, mouse or finger does (a pure state machine)
// - shortcuts + use-editor-keys: the keyboard map
// - use-lightbox-arranging, use-selection: the lightbox, chosen strokes and balloon rooms
// - editor-stage (the canvas), toolbar, selection-bar, editor-sidebar: what is shown
// Drawing never redraws the whole pass: committed strokes live in one bitmap per
// panel, the stroke under the pen in the overlay, and pan/zoom only moves layers.
import type Konva from 'konva';
import { nanoid } from 'nanoid';
import { useEffect, useMemo, useRef, useState } from 'react';
import { useComments, useFindings } from '@/hooks/use-review';
import type { BeatKind } from '@/lib/gags/status';
import { bleedBox, panelRects, safeBox } from '@/lib/print/geometry';
import { TONE_GREYS, type RoomShape, type Stroke } from '@/lib/strokes/types';
import { CanvasSurface } from './canvas-surface';
import { EditorFrame } from './editor-frame';
import { EditorSidebar, type PointPin } from './editor-sidebar';
import { EditorStage } from './editor-stage';
import type { Effects, Scene, Settings } from './gestures';
import { HelpSheet } from './help-sheet';
import { PinComposer } from './pin-composer';
import { useLightboxImages } from './lightbox-images';
import { drawOverlay } from './overlay';
import { SelectionBar } from './selection-bar';
import { EditorToolbar } from './toolbar';
import type { EditorProps } from './types';
import { ERASER_RADIUS_PX, type Guides, PEN_SIZES, TONE_SIZES, type Tool, stepSize, toolAllowed } from './tools';
import { ApprovalNote, useApproval } from './use-approval';
import { useEditorKeys } from './use-editor-keys';
import { useLightboxArranging } from './use-lightbox-arranging';
import { usePassSession } from './use-pass-session';
import { usePointerGestures } from './use-pointer-gestures';
import { useSelection } from './use-selection';
import { useView } from './use-view';

export type { EditorProps, Guides };

const ALL_GUIDES: Guides = { bleed: true, trim: true, safe: true, panels: true };

export default function Editor(props: EditorProps) {
  const { spec, canDraw, canComment } = props;
  const panels = useMemo(() => panelRects(spec), [spec]);
  const bleed = useMemo(() => bleedBox(spec), [spec]);
  const safe = useMemo(() => safeBox(spec), [spec]);
  const notes = useMemo(() => Object.fromEntries(props.beats.map((b) => [b.kind, b.note])) as Record<BeatKind, string>, [props.beats]);

  const wrapRef = useRef<HTMLDivElement>(null);
  const stageRef = useRef<Konva.Stage>(null);
  const overlayLayerRef = useRef<Konva.Layer>(null);

  const [tool, setTool] = useState<Tool>(canDraw ? 'pen' : 'pan');
  const [penSize, setPenSize] = useState(0.5);
  const [toneSize, setToneSize] = useState(5);
  const [toneGrey, setToneGrey] = useState<number>(40);
  const [roomShape, setRoomShape] = useState<RoomShape>('ellipse');
  const [penOnly, setPenOnly] = useState(false);
  const [eraserCuts, setEraserCuts] = useState(false);
  const [guides, setGuides] = useState<Guides>(ALL_GUIDES);
  const [helpOpen, setHelpOpen] = useState(false);
  const [pointPin, setPointPin] = useState<PointPin | null>(null);
  const [highlight, setHighlight] = useState(true);

  const approved = useApproval({ ...props, tool, wrapRef });
  // The bitmaps' first resolution is the fitted view's (use-view fits the page before effects run).
  const session = usePassSession({ passId: props.passId, canDraw, spec, pxPerMm: () => v.viewRef.current.scale, gate: approved.gateRef });
  const v = useView({ wrapRef, bleed, onSettled: session.rescale });
  const selection = useSelection({ session, panels });
  const arranging = useLightboxArranging({ seriesId: props.seriesId, session, bleed, panels });
  const images = useLightboxImages(session.lightboxes.map((l) => l.uploadId));
  const { data: findings } = useFindings(props.passId, session.seqSeen);
  const { data: threads } = useComments(props.gagId);
  const pinned = (threads ?? []).filter((t) => !t.resolvedAt && (t.target === 'panel' || t.target === 'point'));
  const pins = pinned.filter((t) => t.passId === props.passId);
  // Open pins of earlier passes are offered here too, lettered and marked with their pass.
  const earlier = pinned.filter((t) => t.passNumber !== null && t.passNumber < props.passNumber);
  const [showEarlier, setShowEarlier] = useState(true);
  const flagged = highlight && findings ? findings.panels.flatMap((p) => [...p.roomIntrusionIds, ...p.outsideSafeIds]) : [];

  /** Picking a tool lets go of what the previous one had chosen. */
  const chooseTool = (t: Tool) => {
    setTool(t);
    if (t !== 'room') selection.setRoom(null);
    if (t !== 'lightbox') arranging.setSelected(null);
    if (t !== 'lasso') selection.setIds([]);
  };

  const settings: Settings = { tool, canDraw, penOnly, penSize, toneSize, toneGrey, roomShape, eraserCuts };
  const scene = (): Scene => ({
    spec,
    strokes: () => session.syncRef.current?.doc.strokes.values() ?? [],
    selection: selection.strokes(),
    eraserRadius: ERASER_RADIUS_PX / v.viewRef.current.scale,
    newId: nanoid,
  });
  const apply = (fx: Effects) => {
    if (fx.drawn && fx.undo) session.commitDrawn(fx.drawn, fx.undo);
    else if (fx.erased && fx.ops) session.commitErased(fx.ops);
    else if (fx.ops) session.commit(fx.ops, fx.undo);
    else if (fx.undo) session.pushUndo(fx.undo);
    if (fx.select) selection.setIds(fx.select);
    if (fx.selectRoom !== undefined) selection.setRoom(fx.selectRoom);
    if (fx.clearLightbox) arranging.setSelected(null);
    if (fx.pin) setPointPin(fx.pin);
    if (fx.panBy) v.panBy(fx.panBy.dx, fx.panBy.dy);
  };
  const redrawOverlay = () => overlayLayerRef.current?.batchDraw();
  const gestures = usePointerGestures({
    wrapRef,
    stageRef,
    view: () => v.viewRef.current,
    setView: v.setView,
    settings,
    scene,
    apply,
    redraw: redrawOverlay,
  });

  useEffect(() => {
    overlayLayerRef.current?.batchDraw();
  }, [findings, highlight]);

  const deleteChosen = () => {
    if (tool === 'lightbox' && arranging.selected) arranging.removeSelected();
    else if (tool === 'room' && selection.room) selection.deleteRoom();
    else selection.deleteStrokes();
  };

  useEditorKeys({ arranging: tool === 'lightbox' && canDraw && !!arranging.selected }, (a) => {
    switch (a.do) {
      case 'undo':
      case 'redo':
        if (canDraw) session.runUndo(a.do);
        return;
      case 'tool':
        if (!toolAllowed(a.tool, { draw: canDraw, comment: canComment })) return false;
        return chooseTool(a.tool);
      case 'zoom':
        return v.zoom(a.factor);
      case 'fit':
        return v.fit();
      case 'pan':
        return v.panBy(a.dx, a.dy);
      case 'nudge':
        return arranging.nudge(a.dx, a.dy);
      case 'width':
        if (tool === 'tone') setToneSize((s) => stepSize(TONE_SIZES, s, a.dir));
        else setPenSize((s) => stepSize(PEN_SIZES, s, a.dir));
        return;
      case 'grey':
        return setToneGrey((g) => stepSize(TONE_GREYS, g, a.dir));
      case 'delete':
        if (canDraw) deleteChosen();
        return;
      case 'escape':
        selection.clear();
        arranging.setSelected(null);
        return setHelpOpen(false);
      case 'pen-only':
        return setPenOnly((on) => !on);
      case 'guides':
        return setGuides((g) => {
          const on = !(g.bleed || g.trim || g.safe || g.panels);
          return { bleed: on, trim: on, safe: on, panels: on };
        });
      case 'help':
        return setHelpOpen((o) => !o);
    }
  });

  const paintOverlay = (ctx: Konva.Context) => {
    const doc = session.syncRef.current?.doc;
    const rasters = session.rasters;
    const px = 1 / v.viewRef.current.scale;
    const cursor = gestures.cursorRef.current;
    drawOverlay(ctx._context as CanvasRenderingContext2D, {
      gesture: gestures.gestureRef.current,
      panels,
      penSize,
      toneSize,
      toneGrey,
      selection: selection.strokes(),
      flagged: flagged.map((id) => doc?.strokes.get(id)).filter((s): s is Stroke => !!s),
      eraserRing: tool === 'eraser' && cursor ? { ...cursor, r: ERASER_RADIUS_PX * px } : null,
      pathOf: (s) => rasters.pathOf(s),
      px,
    });
  };

  const lightboxes = session.lightboxes;
  return (
    <>
      <EditorFrame
        sidebarLabel="Beats, review and revisions"
        toolbar={
          <EditorToolbar
            canDraw={canDraw}
            canComment={canComment}
            tool={tool}
            setTool={chooseTool}
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
            eraserCuts={eraserCuts}
            setEraserCuts={setEraserCuts}
            guides={guides}
            setGuides={setGuides}
            onUndo={() => session.runUndo('undo')}
            onRedo={() => session.runUndo('redo')}
            canUndo={session.undoState.canUndo}
            canRedo={session.undoState.canRedo}
            zoomIn={() => v.zoom(1.25)}
            zoomOut={() => v.zoom(0.8)}
            fit={v.fit}
            openHelp={() => setHelpOpen(true)}
          />
        }
        canvas={
          <>
            <ApprovalNote approval={approved.approval} locked={approved.locked} />
            <SelectionBar
              status={session.status}
              canDraw={canDraw}
              selected={selection.ids.length}
              roomChosen={!!selection.room && tool === 'room'}
              onDeleteStrokes={selection.deleteStrokes}
              onCopyTo={selection.copyTo}
              onDone={() => selection.setIds([])}
              onDeleteRoom={selection.deleteRoom}
            />
            <CanvasSurface
              wrapRef={wrapRef}
              label={`Sketch canvas, pass ${props.passNumber}. ${canDraw ? 'Draw with a pen, mouse or finger.' : 'Read-only.'} Press ? for shortcuts.`}
              canDraw={canDraw}
              tool={tool}
              view={v.view}
              spec={spec}
              loaded={session.loaded}
              counts={{
                strokes: session.strokeCount,
                rooms: session.rooms.length,
                lightboxes: lightboxes.filter((l) => l.visible).length,
                lightboxImages: lightboxes.filter((l) => l.visible && images.get(l.uploadId) instanceof HTMLImageElement).length,
              }}
              onDropFiles={arranging.upload}
            >
              <EditorStage
                stageRef={stageRef}
                strokesLayerRef={session.strokesLayerRef}
                overlayLayerRef={overlayLayerRef}
                size={v.size}
                view={v.view}
                spec={spec}
                panels={panels}
                bleed={bleed}
                safe={safe}
                guides={guides}
                notes={notes}
                tool={tool}
                canDraw={canDraw}
                rasters={session.rasters}
                lightboxes={lightboxes}
                lightboxPreview={arranging.preview}
                images={images}
                selectedLightbox={arranging.selected}
                areaOf={arranging.areaOf}
                onLightboxDown={arranging.setSelected}
                onLightboxEdited={arranging.edited}
                rooms={session.rooms}
                selectedRoom={selection.room}
                onRoomDown={selection.setRoom}
                onRoomEdited={selection.roomEdited}
                pins={pins}
                earlierPins={showEarlier ? earlier : []}
                pointPin={pointPin}
                drawOverlay={paintOverlay}
              />
              {pointPin && canComment && (
                <PinComposer pin={pointPin} view={v.view} size={v.size} gagId={props.gagId} passId={props.passId} onDone={() => setPointPin(null)} />
              )}
            </CanvasSurface>
          </>
        }
        sidebar={
          <EditorSidebar
            {...props}
            notes={notes}
            findings={findings}
            highlight={highlight}
            setHighlight={setHighlight}
            lightboxes={lightboxes}
            arranging={arranging}
            onChooseLightbox={(id) => {
              // Through chooseTool, so the lasso selection and a chosen room are let go, as for any tool change.
              if (canDraw) chooseTool('lightbox');
              arranging.setSelected(id);
            }}
            pointPin={pointPin}
            setPointPin={setPointPin}
            onRestored={() => void session.syncRef.current?.resync()}
            threads={threads}
            earlier={earlier}
            showEarlier={showEarlier}
            setShowEarlier={setShowEarlier}
          />
        }
      />
      <HelpSheet open={helpOpen} onClose={() => setHelpOpen(false)} />
      {approved.dialog}
    </>
  );
}
