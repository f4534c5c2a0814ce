'use client';
// The element the pen draws on: it holds the stage, says what it shows to
// assistive technology and tests (stroke, room and lightbox counts), and takes
// image files dropped on it as uploads for the panel under the pointer.
import { type RefObject, useState } from 'react';
import { type PageSpec, panelAt } from '@/lib/print/geometry';
import { type View, toPage } from '@/lib/print/view';
import type { Tool } from './tools';

export function CanvasSurface(p: {
  wrapRef: RefObject<HTMLDivElement | null>;
  label: string;
  canDraw: boolean;
  tool: Tool;
  view: View;
  spec: PageSpec;
  counts: { strokes: number; rooms: number; lightboxes: number; lightboxImages: number };
  /** Every stroke of the pass has arrived and is drawn. */
  loaded: boolean;
  onDropFiles: (files: FileList, panel: number | null) => void;
  children: React.ReactNode;
}) {
  const [dropOver, setDropOver] = useState(false);
  // The ref is taken out of the props first: the rest are plain values to render.
  const { wrapRef, ...v } = p;
  const { canDraw } = v;
  return (
    <div
      ref={wrapRef}
      role="application"
      aria-label={v.label}
      data-testid="sketch-canvas"
      data-stroke-count={v.counts.strokes}
      data-loaded={v.loaded ? 'true' : 'false'}
      data-px-per-mm={v.view.scale}
      aria-busy={!v.loaded}
      data-room-count={v.counts.rooms}
      data-lightbox-count={v.counts.lightboxes}
      data-lightbox-images={v.counts.lightboxImages}
      data-tool={v.tool}
      tabIndex={0}
      className={`relative h-full w-full touch-none overflow-hidden rounded-lg border bg-marker-10 ${dropOver ? 'border-ink ring-2 ring-ink' : 'border-paper-edge'}`}
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
        const rect = e.currentTarget.getBoundingClientRect();
        const mm = toPage(v.view, e.clientX - rect.left, e.clientY - rect.top);
        v.onDropFiles(e.dataTransfer.files, panelAt(v.spec, mm.x, mm.y));
      }}
      style={{ cursor: v.tool === 'pan' || !canDraw ? 'grab' : 'crosshair' }}
    >
      {v.children}
    </div>
  );
}
