// The board's small glyphs, drawn here rather than taken from an icon
// library: the board page is the most visited, and its first load stays light.
type GlyphProps = { className?: string };

const common = {
  viewBox: '0 0 16 16',
  fill: 'none',
  stroke: 'currentColor',
  strokeWidth: 1.6,
  strokeLinecap: 'round',
  strokeLinejoin: 'round',
} as const;

/** Four panels: the columns view. */
export function PanelsGlyph({ className }: GlyphProps) {
  return (
    <svg {...common} className={className} aria-hidden="true">
      <rect x="2" y="2" width="5" height="5" rx="0.8" />
      <rect x="9" y="2" width="5" height="5" rx="0.8" />
      <rect x="2" y="9" width="5" height="5" rx="0.8" />
      <rect x="9" y="9" width="5" height="5" rx="0.8" />
    </svg>
  );
}

/** Ruled rows: the table view. */
export function RowsGlyph({ className }: GlyphProps) {
  return (
    <svg {...common} className={className} aria-hidden="true">
      <rect x="2" y="2.5" width="12" height="11" rx="1" />
      <path d="M2 6.5h12M2 10h12M6 6.5v7" />
    </svg>
  );
}

/** A loupe: search. */
export function LoupeGlyph({ className }: GlyphProps) {
  return (
    <svg {...common} className={className} aria-hidden="true">
      <circle cx="7" cy="7" r="4.2" />
      <path d="M10.2 10.2 14 14" />
    </svg>
  );
}

/** Two rows of dots: a grip to pick a card up by. */
export function GripGlyph({ className }: GlyphProps) {
  return (
    <svg viewBox="0 0 16 16" fill="currentColor" className={className} aria-hidden="true">
      {[3.5, 8, 12.5].map((y) => (
        <g key={y}>
          <circle cx="5.5" cy={y} r="1.3" />
          <circle cx="10.5" cy={y} r="1.3" />
        </g>
      ))}
    </svg>
  );
}
