// A final page as the reader sees it: the trimmed page (what the knife leaves), with the
// scan placed by its fit through lib/print/final-fit, the same arithmetic as the fit view
// and the print file. Units are mm from the trim's top left; the SVG scales to its box.
import { useId } from 'react';
import { type Fit, type ScanSize, imageFrame, placedBox } from '@/lib/print/final-fit';
import type { PageSpec } from '@/lib/print/geometry';

const r = (n: number) => Math.round(n * 1000) / 1000;

export function FittedPage({ spec, scan, fit, imageUrl, label }: { spec: PageSpec; scan: ScanSize; fit: Fit; imageUrl: string; label: string }) {
  // One id per page drawn: several pages share the document, and clip-path ids are global.
  const clip = `trim-${useId().replace(/:/g, '')}`;
  const f = imageFrame(placedBox(spec, fit, scan));
  return (
    <svg viewBox={`0 0 ${r(spec.trimW)} ${r(spec.trimH)}`} role="img" aria-label={label} className="block h-full w-full" data-testid="fitted-page">
      <defs>
        <clipPath id={clip}>
          <rect x={0} y={0} width={r(spec.trimW)} height={r(spec.trimH)} />
        </clipPath>
      </defs>
      <g clipPath={`url(#${clip})`}>
        <rect x={0} y={0} width={r(spec.trimW)} height={r(spec.trimH)} fill="#ffffff" />
        <image
          href={imageUrl}
          x={r(-f.w / 2)}
          y={r(-f.h / 2)}
          width={r(f.w)}
          height={r(f.h)}
          preserveAspectRatio="none"
          transform={`translate(${r(f.cx)} ${r(f.cy)}) rotate(${f.rotation})`}
        />
      </g>
    </svg>
  );
}
