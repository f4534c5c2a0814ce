'use client';
// The canvas: Konva layers for the page and its guides, the lightbox, the stroke
// bitmaps (one per panel), and the overlay (rooms, comment pins, the gesture in
// progress). All layers share the view transform, so every unit here is a mm.
import type Konva from 'konva';
import { type RefObject, useEffect, useRef } from 'react';
import { Circle, Ellipse, Group, Image as KImage, Layer, Rect, Shape, Stage, Text, Transformer } from 'react-konva';
import type { ThreadDto } from '@/db/queries/comments';
import { BEAT_KINDS, BEAT_LABELS, type BeatKind } from '@/lib/gags/status';
import type { PageSpec, Rect as MmRect } from '@/lib/print/geometry';
import type { View } from '@/lib/print/view';
import { turned } from '@/lib/strokes/lightbox';
import type { Lightbox, Room } from '@/lib/strokes/types';
import type { LoadedImage } from './lightbox-images';
import type { PanelRasters } from './panel-rasters';
import { pinLetter } from './editor-sidebar';
import type { Guides, Tool } from './tools';

const INK = '#1d4e6e';
const WARN = '#b8321f';

export function EditorStage(p: {
  stageRef: RefObject<Konva.Stage | null>;
  strokesLayerRef: RefObject<Konva.Layer | null>;
  overlayLayerRef: RefObject<Konva.Layer | null>;
  size: { w: number; h: number };
  view: View;
  spec: PageSpec;
  panels: MmRect[];
  bleed: MmRect;
  safe: MmRect;
  guides: Guides;
  notes: Record<BeatKind, string>;
  tool: Tool;
  canDraw: boolean;
  rasters: PanelRasters;
  lightboxes: Lightbox[];
  lightboxPreview: Lightbox | null;
  images: Map<string, LoadedImage>;
  selectedLightbox: string | null;
  areaOf: (panel: number | null) => MmRect;
  onLightboxDown: (id: string) => void;
  onLightboxEdited: (id: string, node: Konva.Node) => void;
  rooms: Room[];
  selectedRoom: string | null;
  onRoomDown: (id: string) => void;
  onRoomEdited: (id: string, node: Konva.Shape) => void;
  pins: ThreadDto[];
  /** Open pins of earlier passes: hollow and lettered, so they read as carried over. */
  earlierPins: ThreadDto[];
  pointPin: { x: number; y: number } | null;
  drawOverlay: (ctx: Konva.Context) => void;
}) {
  // Refs are taken out of the props first: the rest of the props are plain values to render.
  const { stageRef, strokesLayerRef, overlayLayerRef, rasters, ...v } = p;
  const { view, spec, panels, bleed, safe, guides, tool, canDraw } = v;
  const roomTransformer = useRef<Konva.Transformer>(null);
  const roomNodes = useRef(new Map<string, Konva.Shape>());
  const lightboxTransformer = useRef<Konva.Transformer>(null);
  const lightboxNodes = useRef(new Map<string, Konva.Node>());
  const arranging = tool === 'lightbox' && canDraw;
  const roomsEditable = tool === 'room' && canDraw;

  // The handles follow the chosen room or lightbox while its tool is on.
  useEffect(() => {
    const tr = roomTransformer.current;
    if (!tr) return;
    const node = v.selectedRoom ? roomNodes.current.get(v.selectedRoom) : undefined;
    tr.nodes(node && tool === 'room' ? [node] : []);
    tr.getLayer()?.batchDraw();
  }, [v.selectedRoom, v.rooms, tool]);
  useEffect(() => {
    const tr = lightboxTransformer.current;
    if (!tr) return;
    const node = v.selectedLightbox ? lightboxNodes.current.get(v.selectedLightbox) : undefined;
    tr.nodes(node && arranging ? [node] : []);
    tr.getLayer()?.batchDraw();
  }, [v.selectedLightbox, v.lightboxes, arranging, v.images]);

  const layer = { x: view.originX, y: view.originY, scaleX: view.scale, scaleY: view.scale };
  const hair = { strokeScaleEnabled: false, listening: false } as const;

  return (
    <Stage ref={stageRef} width={v.size.w} height={v.size.h}>
      <Layer listening={false} {...layer}>
        <Rect x={bleed.x} y={bleed.y} width={bleed.w} height={bleed.h} fill="#ffffff" shadowColor="#2a2a2d" shadowOpacity={0.15} shadowBlur={8} />
        {guides.bleed && (
          <>
            <Rect x={bleed.x} y={bleed.y} width={bleed.w} height={spec.bleed} fill={WARN} opacity={0.06} />
            <Rect x={bleed.x} y={spec.trimH} width={bleed.w} height={spec.bleed} fill={WARN} opacity={0.06} />
            <Rect x={bleed.x} y={0} width={spec.bleed} height={spec.trimH} fill={WARN} opacity={0.06} />
            <Rect x={spec.trimW} y={0} width={spec.bleed} height={spec.trimH} fill={WARN} opacity={0.06} />
          </>
        )}
        {guides.panels && panels.map((r, i) => <Rect key={i} x={r.x} y={r.y} width={r.w} height={r.h} stroke="#b4b1aa" strokeWidth={1} {...hair} />)}
        {panels.map((r, i) => {
          const kind = BEAT_KINDS[i]!;
          return (
            <Text
              key={kind}
              x={r.x}
              y={i < 2 ? bleed.y - 5 : bleed.y + bleed.h + 1.2}
              width={r.w}
              text={`${i + 1} ${BEAT_LABELS[kind]}${v.notes[kind] ? ` — ${v.notes[kind]}` : ''}`}
              fontSize={2.6}
              fill="#4a4a50"
              wrap="none"
              ellipsis
            />
          );
        })}
      </Layer>
      <Layer listening={arranging} {...layer}>
        {v.lightboxes.map((saved) => {
          const l = v.lightboxPreview?.id === saved.id ? v.lightboxPreview : saved;
          if (!l.visible) return null;
          const area = v.areaOf(l.panel);
          const img = v.images.get(l.uploadId);
          const iw = turned(l.rotation) ? l.h : l.w;
          const ih = turned(l.rotation) ? l.w : l.h;
          const common = {
            name: 'lightbox',
            x: l.x + l.w / 2,
            y: l.y + l.h / 2,
            offsetX: iw / 2,
            offsetY: ih / 2,
            width: iw,
            height: ih,
            rotation: l.rotation,
            draggable: arranging,
            onPointerDown: () => v.onLightboxDown(l.id),
            onDragEnd: (e: Konva.KonvaEventObject<DragEvent>) => v.onLightboxEdited(l.id, e.target),
            onTransformEnd: (e: Konva.KonvaEventObject<Event>) => v.onLightboxEdited(l.id, e.target),
            ref: (node: Konva.Node | null) => {
              if (node) lightboxNodes.current.set(l.id, node);
              else lightboxNodes.current.delete(l.id);
            },
          };
          const key = `${l.id}-${l.x}-${l.y}-${l.w}-${l.h}-${l.rotation}`;
          return (
            <Group key={l.id} clipX={area.x} clipY={area.y} clipWidth={area.w} clipHeight={area.h}>
              {img === 'missing' ? (
                <Rect key={key} {...common} stroke={WARN} strokeWidth={1} strokeScaleEnabled={false} dash={[6, 4]} fill="rgba(184,50,31,0.04)" />
              ) : img ? (
                <KImage key={key} {...common} image={img} opacity={l.opacity} />
              ) : (
                <Rect key={key} {...common} fill="#ebe7df" opacity={l.opacity} />
              )}
            </Group>
          );
        })}
        <Transformer
          ref={lightboxTransformer}
          rotateEnabled={false}
          keepRatio
          enabledAnchors={['top-left', 'top-right', 'bottom-left', 'bottom-right']}
          ignoreStroke
        />
      </Layer>
      <Layer ref={strokesLayerRef} listening={false} {...layer}>
        {panels.map((r, i) => (
          <KImage key={i} image={rasters.canvases[i]} x={r.x} y={r.y} width={r.w} height={r.h} />
        ))}
      </Layer>
      <Layer ref={overlayLayerRef} {...layer}>
        {guides.trim && <Rect x={0} y={0} width={spec.trimW} height={spec.trimH} stroke={WARN} strokeWidth={1} {...hair} />}
        {guides.safe && <Rect x={safe.x} y={safe.y} width={safe.w} height={safe.h} stroke={INK} strokeWidth={1} dash={[4, 3]} {...hair} />}
        {v.rooms.map((room) => {
          const common = {
            name: 'room',
            fill: 'rgba(219,232,240,0.55)',
            stroke: INK,
            strokeWidth: 1.5,
            strokeScaleEnabled: false,
            dash: [5, 3],
            listening: roomsEditable,
            draggable: roomsEditable,
            onPointerDown: () => v.onRoomDown(room.id),
            onDragEnd: (e: Konva.KonvaEventObject<DragEvent>) => v.onRoomEdited(room.id, e.target as Konva.Shape),
            onTransformEnd: (e: Konva.KonvaEventObject<Event>) => v.onRoomEdited(room.id, e.target as Konva.Shape),
            ref: (node: Konva.Shape | null) => {
              if (node) roomNodes.current.set(room.id, node);
              else roomNodes.current.delete(room.id);
            },
          };
          const key = `${room.id}-${room.x}-${room.y}-${room.w}-${room.h}`;
          return room.shape === 'ellipse' ? (
            <Ellipse key={key} x={room.x + room.w / 2} y={room.y + room.h / 2} radiusX={room.w / 2} radiusY={room.h / 2} {...common} />
          ) : (
            <Rect key={key} x={room.x} y={room.y} width={room.w} height={room.h} cornerRadius={1} {...common} />
          );
        })}
        {v.pins.map((t, i) => (
          <PinMark key={t.id} thread={t} panels={panels} scale={view.scale} label={String(i + 1)} />
        ))}
        {v.earlierPins.map((t, i) => (
          <PinMark key={t.id} thread={t} panels={panels} scale={view.scale} label={pinLetter(i)} hollow />
        ))}
        {v.pointPin && (
          <Circle
            x={v.pointPin.x}
            y={v.pointPin.y}
            radius={6 / view.scale}
            fill={WARN}
            stroke="#ffffff"
            strokeWidth={1.5}
            strokeScaleEnabled={false}
            listening={false}
          />
        )}
        <Transformer ref={roomTransformer} rotateEnabled={false} ignoreStroke keepRatio={false} />
        <Shape sceneFunc={v.drawOverlay} listening={false} />
      </Layer>
    </Stage>
  );
}

/** A comment pin: filled and numbered for this pass, hollow and lettered for one carried from an earlier pass. */
function PinMark({
  thread: t,
  panels,
  scale,
  label,
  hollow,
}: {
  thread: ThreadDto;
  panels: MmRect[];
  scale: number;
  label: string;
  hollow?: boolean;
}) {
  const r = panels[t.panel ?? 0]!;
  const x = t.target === 'point' && t.x !== null ? t.x : r.x + 3;
  const y = t.target === 'point' && t.y !== null ? t.y : r.y + 3;
  const rad = 9 / scale;
  return (
    <Group x={x} y={y} listening={false} name={hollow ? 'earlier-pin' : 'comment-pin'}>
      <Circle
        radius={rad}
        fill={hollow ? '#ffffff' : INK}
        stroke={hollow ? INK : '#ffffff'}
        strokeWidth={hollow ? 2 : 1.5}
        dash={hollow ? [3, 2] : undefined}
        strokeScaleEnabled={false}
      />
      <Text
        text={label}
        fontSize={11 / scale}
        fill={hollow ? INK : '#ffffff'}
        width={2 * rad}
        height={2 * rad}
        offsetX={rad}
        offsetY={rad}
        align="center"
        verticalAlign="middle"
        fontStyle="bold"
      />
    </Group>
  );
}
