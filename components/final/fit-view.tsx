'use client';
// The live view of a fit: the scan placed on the page by lib/print/final-fit (the same
// geometry the print file uses), with the bleed, trim and safe area drawn over it and
// what the knife cuts away shaded. Dragging the scan moves it (in mm on the page).
import { useRef } from 'react';
import { type Fit, type ScanSize, imageFrame, placedBox } from '@/lib/print/final-fit';
import { type PageSpec, bleedBox, safeBox } from '@/lib/print/geometry';

const MARGIN = 6; // mm of table around the bleed box

export function FitView({
  spec,
  scan,
  fit,
  imageUrl,
  onMove,
  label,
}: {
  spec: PageSpec;
  scan: ScanSize;
  fit: Fit;
  imageUrl: string;
  onMove?: (dx: number, dy: number) => void;
  label: string;
}) {
  const svg = useRef<SVGSVGElement>(null);
  const drag = useRef<{ x: number; y: number } | null>(null);
  const b = bleedBox(spec);
  const s = safeBox(spec);
  const f = imageFrame(placedBox(spec, fit, scan));
  const view = [b.x - MARGIN, b.y - MARGIN, b.w + 2 * MARGIN, b.h + 2 * MARGIN] as const;
  /** Screen pixels → mm on the page, through the SVG's own transform. */
  const toMm = (clientX: number, clientY: number) => {
    const m = svg.current?.getScreenCTM();
    if (!m) return null;
    const p = new DOMPoint(clientX, clientY).matrixTransform(m.inverse());
    return { x: p.x, y: p.y };
  };
  const r = (n: number) => Math.round(n * 1000) / 1000;
  return (
    <svg
      ref={svg}
      viewBox={view.join(' ')}
      role="img"
      aria-label={label}
      className={`w-full max-w-xl touch-none select-none rounded-md border border-paper-edge bg-marker-10 ${onMove ? 'cursor-move' : ''}`}
      data-testid="fit-view"
      onPointerDown={(e) => {
        if (!onMove) return;
        drag.current = toMm(e.clientX, e.clientY);
        (e.target as Element).setPointerCapture?.(e.pointerId);
      }}
      onPointerMove={(e) => {
        const from = drag.current;
        const to = from && toMm(e.clientX, e.clientY);
        if (!from || !to || !onMove) return;
        onMove(r(to.x - from.x), r(to.y - from.y));
        drag.current = to;
      }}
      onPointerUp={() => (drag.current = null)}
      onPointerCancel={() => (drag.current = null)}
    >
      <rect x={b.x} y={b.y} width={b.w} height={b.h} fill="#ffffff" />
      <image
        href={imageUrl}
        x={-f.w / 2}
        y={-f.h / 2}
        width={f.w}
        height={f.h}
        preserveAspectRatio="none"
        transform={`translate(${r(f.cx)} ${r(f.cy)}) rotate(${f.rotation})`}
      />
      {/* Cut away by the knife: everything outside the trim, shaded. */}
      <path
        d={`M${view[0]} ${view[1]}h${view[2]}v${view[3]}h${-view[2]}z M0 0v${spec.trimH}h${spec.trimW}v${-spec.trimH}z`}
        fill="rgba(40, 40, 48, 0.35)"
        fillRule="evenodd"
      />
      <rect x={b.x} y={b.y} width={b.w} height={b.h} fill="none" stroke="#b8331e" strokeWidth={0.35} strokeDasharray="2 1.2" />
      <rect x={0} y={0} width={spec.trimW} height={spec.trimH} fill="none" stroke="#28282e" strokeWidth={0.4} />
      <rect x={s.x} y={s.y} width={s.w} height={s.h} fill="none" stroke="#1c4f6e" strokeWidth={0.35} strokeDasharray="1.5 1.5" />
    </svg>
  );
}

export function FitLegend() {
  return (
    <p className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-graphite-soft">
      <span>
        <span aria-hidden className="mr-1 inline-block w-5 border-t-2 border-dashed border-[#b8331e] align-middle" />
        bleed (art must reach it)
      </span>
      <span>
        <span aria-hidden className="mr-1 inline-block w-5 border-t-2 border-[#28282e] align-middle" />
        trim (where the knife cuts; shaded beyond)
      </span>
      <span>
        <span aria-hidden className="mr-1 inline-block w-5 border-t-2 border-dotted border-[#1c4f6e] align-middle" />
        safe area (keep what matters inside)
      </span>
    </p>
  );
}
