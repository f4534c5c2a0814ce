'use client';
// Two passes side by side or overlaid (the older tinted, at an adjustable
// opacity), at real printed size after a one-time calibration, or squinted.
import Link from 'next/link';
import { useMemo, useState, useSyncExternalStore } from 'react';
import { useComments } from '@/hooks/use-review';
import type { PageSpec } from '@/lib/print/geometry';
import { panelRects } from '@/lib/print/geometry';
import { pinLabel } from './comments-panel';
import { PresenceBar } from './presence-bar';
import { PassPicker } from './pass-picker';

/** ISO/IEC 7810 ID-1 card (bank-card size): 85.60 × 53.98 mm. */
export const ID1_MM = { w: 85.6, h: 53.98 };
/** CSS assumes 96 px per inch: 96 / 25.4 px per mm, until the screen is calibrated. */
export const CSS_PX_PER_MM = 96 / 25.4;
const CAL_KEY = 'quadrille.pxPerMm';
const CAL_EVENT = 'quadrille:calibrated';

// The calibration is kept in this browser's storage; the server renders the browser's guess.
function subscribeCalibration(changed: () => void) {
  window.addEventListener('storage', changed);
  window.addEventListener(CAL_EVENT, changed);
  return () => {
    window.removeEventListener('storage', changed);
    window.removeEventListener(CAL_EVENT, changed);
  };
}
function useCalibration(): [number, (pxPerMm: number) => void] {
  const value = useSyncExternalStore(
    subscribeCalibration,
    () => Number(localStorage.getItem(CAL_KEY)) || CSS_PX_PER_MM,
    () => CSS_PX_PER_MM,
  );
  const save = (pxPerMm: number) => {
    localStorage.setItem(CAL_KEY, String(pxPerMm));
    window.dispatchEvent(new Event(CAL_EVENT));
  };
  return [value, save];
}

type PassSvg = { id: string; number: number; svg: string };
type Mode = 'side' | 'overlay' | 'print' | 'squint';

/** The SVG names itself ("Pass N"); the wrapper only sizes it. */
function Page({ svg, label, style }: { svg: string; label: string; style?: React.CSSProperties }) {
  return <div data-label={label} className="[&>svg]:h-full [&>svg]:w-full" style={style} dangerouslySetInnerHTML={{ __html: svg }} />;
}

export function CompareView({
  seriesId,
  gagId,
  gagTitle,
  meId,
  spec,
  passes,
}: {
  seriesId: string;
  gagId: string;
  gagTitle: string;
  meId: string;
  spec: PageSpec;
  passes: PassSvg[];
}) {
  const [a, setA] = useState(passes[Math.max(0, passes.length - 2)]?.id ?? '');
  const [b, setB] = useState(passes[passes.length - 1]?.id ?? '');
  const [mode, setMode] = useState<Mode>('side');
  const [opacity, setOpacity] = useState(0.5);
  const [pxPerMm, setPxPerMm] = useCalibration();
  const [calibrating, setCalibrating] = useState(false);
  const { data: threads } = useComments(gagId);
  const passA = passes.find((p) => p.id === a);
  const passB = passes.find((p) => p.id === b);
  const bleedW = spec.trimW + 2 * spec.bleed;
  const panels = useMemo(() => panelRects(spec), [spec]);
  const pinsOf = (passId: string) =>
    (threads ?? []).filter((t) => t.passId === passId && !t.resolvedAt && (t.target === 'panel' || t.target === 'point'));

  const pins = (passId: string) => (
    <>
      {pinsOf(passId).map((t, i) => {
        const r = panels[t.panel ?? 0]!;
        const x = t.target === 'point' && t.x !== null ? t.x : r.x + 3;
        const y = t.target === 'point' && t.y !== null ? t.y : r.y + 3;
        return (
          <span
            key={t.id}
            title={`${pinLabel(t)}: ${t.body}`}
            className="absolute flex h-5 w-5 -translate-x-1/2 -translate-y-1/2 items-center justify-center rounded-full bg-ink text-[10px] font-bold text-white shadow"
            style={{ left: `${((x + spec.bleed) / bleedW) * 100}%`, top: `${((y + spec.bleed) / (spec.trimH + 2 * spec.bleed)) * 100}%` }}
          >
            {i + 1}
          </span>
        );
      })}
    </>
  );

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <p className="text-sm text-graphite-faint">
            <Link href={`/series/${seriesId}/gags/${gagId}`} className="hover:underline">
              {gagTitle}
            </Link>{' '}
            / compare
          </p>
          <h1 className="text-2xl font-extrabold">Compare passes</h1>
          <PresenceBar gagId={gagId} where="compare" meId={meId} />
        </div>
        <div className="flex flex-wrap items-end gap-3">
          <PassPicker label="Older (A)" passes={passes} value={a} onChange={setA} />
          <PassPicker label="Newer (B)" passes={passes} value={b} onChange={setB} />
          <div role="group" aria-label="View" className="inline-flex rounded-md border border-paper-edge bg-white p-0.5">
            {(
              [
                ['side', 'Side by side'],
                ['overlay', 'Overlay'],
                ['print', 'Print size'],
                ['squint', 'Squint'],
              ] as const
            ).map(([m, label]) => (
              <button
                key={m}
                type="button"
                aria-pressed={mode === m}
                onClick={() => setMode(m)}
                className={`rounded px-3 py-1.5 text-sm font-bold ${mode === m ? 'bg-ink text-white' : 'text-graphite-soft hover:bg-paper-deep'}`}
              >
                {label}
              </button>
            ))}
          </div>
        </div>
      </div>

      {passes.length < 1 && <p className="text-graphite-soft">This gag has no pass yet.</p>}

      {mode === 'side' && passA && passB && (
        <div className="grid gap-4 md:grid-cols-2" data-testid="compare-side">
          {[passA, passB].map((p, i) => (
            <figure key={`${p.id}-${i}`} className="panel p-2">
              <div className="relative aspect-square">
                <Page svg={p.svg} label={`Pass ${p.number}`} style={{ width: '100%', height: '100%' }} />
                {pins(p.id)}
              </div>
              <figcaption className="mt-1 text-sm font-bold">
                {i === 0 ? 'A' : 'B'} · Pass {p.number}
              </figcaption>
              <ol className="mt-1 list-decimal space-y-0.5 pl-5 text-xs text-graphite-soft">
                {pinsOf(p.id).map((t) => (
                  <li key={t.id}>
                    {pinLabel(t)}: {t.body}
                  </li>
                ))}
              </ol>
            </figure>
          ))}
        </div>
      )}

      {mode === 'overlay' && passA && passB && (
        <div className="space-y-2" data-testid="compare-overlay">
          <label className="flex max-w-md items-center gap-2 text-sm font-bold text-graphite-soft">
            Pass {passA.number} opacity
            <input
              type="range"
              min={0}
              max={1}
              step={0.05}
              value={opacity}
              onChange={(e) => setOpacity(Number(e.target.value))}
              className="flex-1"
              aria-label="Opacity of the older pass"
            />
            <span className="w-10 text-right">{Math.round(opacity * 100)}%</span>
          </label>
          <div className="panel relative mx-auto aspect-square max-w-2xl">
            <Page svg={passB.svg} label={`Pass ${passB.number}`} style={{ position: 'absolute', inset: 0 }} />
            {/* The older pass tinted ink-blue, laid over the newer one; white drops out with multiply. */}
            <Page
              svg={passA.svg}
              label={`Pass ${passA.number}, tinted`}
              style={{ position: 'absolute', inset: 0, opacity, mixBlendMode: 'multiply', filter: 'sepia(1) saturate(6) hue-rotate(170deg)' }}
            />
          </div>
          <p className="text-center text-sm text-graphite-soft">
            Pass {passB.number} in graphite; pass {passA.number} tinted blue.
          </p>
        </div>
      )}

      {mode === 'print' && passB && (
        <div className="space-y-3" data-testid="compare-print">
          <p className="text-sm text-graphite-soft">
            Pass {passB.number} at its printed size: {spec.trimW} × {spec.trimH} mm trim.{' '}
            {pxPerMm === CSS_PX_PER_MM
              ? 'This screen is not calibrated yet, so the size is the browser’s guess.'
              : `Calibrated: ${pxPerMm.toFixed(3)} px per mm.`}{' '}
            <button type="button" className="font-bold text-ink underline" onClick={() => setCalibrating((c) => !c)}>
              {calibrating ? 'Done calibrating' : 'Calibrate with a card'}
            </button>
          </p>
          {calibrating && (
            <div className="panel space-y-2 p-3">
              <p className="text-sm">
                Hold a bank-sized card (ISO/IEC 7810 ID-1, 85.60 × 53.98 mm) against the screen and resize the rectangle until it matches the card.
              </p>
              <div
                className="rounded-md border-2 border-ink bg-ink-light"
                style={{ width: ID1_MM.w * pxPerMm, height: ID1_MM.h * pxPerMm }}
                data-testid="calibration-card"
              />
              <label className="flex max-w-lg items-center gap-2 text-sm font-bold">
                Card width on screen
                <input
                  type="range"
                  min={150}
                  max={700}
                  step={1}
                  value={Math.round(ID1_MM.w * pxPerMm)}
                  aria-label="Card width in pixels"
                  onChange={(e) => {
                    const v = Number(e.target.value) / ID1_MM.w;
                    setPxPerMm(v);
                  }}
                  className="flex-1"
                />
              </label>
            </div>
          )}
          <div className="overflow-auto">
            <Page
              svg={passB.svg}
              label={`Pass ${passB.number} at print size`}
              style={{ width: bleedW * pxPerMm, height: (spec.trimH + 2 * spec.bleed) * pxPerMm }}
            />
          </div>
        </div>
      )}

      {mode === 'squint' && passA && passB && (
        <div className="flex flex-wrap items-start gap-8" data-testid="compare-squint">
          {[passA, passB].map((p, i) => (
            <figure key={`${p.id}-${i}`} className="text-center">
              <Page svg={p.svg} label={`Pass ${p.number}, squinting`} style={{ width: 140, height: 140, filter: 'blur(1.6px)' }} />
              <figcaption className="mt-1 text-sm">Pass {p.number}</figcaption>
            </figure>
          ))}
          <p className="max-w-sm text-sm text-graphite-soft">Small and blurred, the way a page is first seen: does the gag still read at a glance?</p>
        </div>
      )}
    </div>
  );
}
