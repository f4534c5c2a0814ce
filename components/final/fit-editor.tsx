'use client';
// Fitting a final page: to the trim or the bleed, moved (drag, or mm fields), scaled and
// turned, with the live view and the effective resolution updating as it changes.
import { RotateCw } from 'lucide-react';
import { useState } from 'react';
import useSWR from 'swr';
import { Button } from '@/components/ui/button';
import type { FinalPageDto } from '@/db/queries/final-pages';
import { fetcher, messageOf } from '@/lib/http/client';
import type { PagePreflight } from '@/lib/print/preflight';
import { type Fit, type Quarter, placedBox, placedPpi } from '@/lib/print/final-fit';
import type { PageSpec } from '@/lib/print/geometry';
import { PRINTER_FIRST, resolutionCheck } from '@/lib/print/preflight-rules';
import { ChecksList } from './checks-list';
import { FitLegend, FitView } from './fit-view';

const r2 = (n: number) => Math.round(n * 100) / 100;

function NumberIn({
  label,
  value,
  step,
  onChange,
  disabled,
}: {
  label: string;
  value: number;
  step: number;
  onChange: (v: number) => void;
  disabled: boolean;
}) {
  return (
    <label className="text-sm font-bold text-graphite-soft">
      {label}
      <input
        type="number"
        className="field mt-1 w-24 py-1.5"
        step={step}
        value={value}
        disabled={disabled}
        onChange={(e) => {
          const v = Number(e.target.value);
          if (e.target.value !== '' && Number.isFinite(v)) onChange(v);
        }}
      />
    </label>
  );
}

export function FitEditor({
  page,
  spec,
  canEdit,
  onSave,
  message: [msg, setMsg],
}: {
  page: FinalPageDto;
  spec: PageSpec;
  canEdit: boolean;
  onSave: (fit: Fit) => Promise<unknown>;
  /** What the last save said, kept by the panel: a saved fit remounts this editor with the new fit. */
  message: [string | null, (m: string | null) => void];
}) {
  const [fit, setFit] = useState<Fit>(page.fit);
  const [busy, setBusy] = useState(false);
  // The page's preflight at its saved fit (measuring the scan the first time takes a few seconds).
  const preflight = useSWR<PagePreflight>(`/api/final-pages/${page.id}/preflight`, fetcher);
  const set = (patch: Partial<Fit>) => {
    setMsg(null);
    setFit((f) => ({ ...f, ...patch }));
  };
  const scan = { width: page.width, height: page.height };
  const ppi = placedPpi(placedBox(spec, fit, scan), scan);
  const check = resolutionCheck(ppi, page.colour);
  const changed = JSON.stringify(fit) !== JSON.stringify(page.fit);
  return (
    <div className="grid gap-4 lg:grid-cols-[minmax(0,36rem)_1fr]">
      <div className="space-y-2">
        <FitView
          spec={spec}
          scan={scan}
          fit={fit}
          imageUrl={`/api/final-pages/${page.id}/image/display`}
          onMove={canEdit ? (dx, dy) => set({ x: r2(fit.x + dx), y: r2(fit.y + dy) }) : undefined}
          label={`The final page fitted to the ${fit.to}, with the bleed, trim and safe area drawn over it`}
        />
        <FitLegend />
      </div>
      <div className="space-y-3">
        <fieldset className="space-y-2" disabled={!canEdit}>
          <legend className="text-sm font-bold text-graphite-soft">Fit to</legend>
          {(['trim', 'bleed'] as const).map((to) => (
            <label key={to} className="mr-4 inline-flex items-center gap-1.5 text-sm">
              <input type="radio" name={`fit-to-${page.id}`} checked={fit.to === to} onChange={() => set({ to, x: 0, y: 0, scale: 1 })} />
              {to === 'trim' ? 'the trim (drawn to the trim size)' : 'the bleed (drawn with its bleed)'}
            </label>
          ))}
        </fieldset>
        <div className="flex flex-wrap items-end gap-3">
          <NumberIn label="Across (mm)" step={0.1} value={fit.x} disabled={!canEdit} onChange={(x) => set({ x })} />
          <NumberIn label="Down (mm)" step={0.1} value={fit.y} disabled={!canEdit} onChange={(y) => set({ y })} />
          <NumberIn
            label="Scale"
            step={0.005}
            value={fit.scale}
            disabled={!canEdit}
            onChange={(scale) => set({ scale: Math.min(10, Math.max(0.1, scale)) })}
          />
          <Button
            variant="secondary"
            disabled={!canEdit}
            onClick={() => set({ rotation: ((fit.rotation + 90) % 360) as Quarter })}
            aria-label="Turn a quarter clockwise"
          >
            <RotateCw aria-hidden className="h-4 w-4" /> Turn ({fit.rotation}°)
          </Button>
        </div>
        <p className={`text-sm ${check.level === 'ok' ? 'text-graphite-soft' : 'text-stamp'}`} data-testid="fit-resolution">
          {check.message} <span className="text-graphite-faint">{PRINTER_FIRST}</span>
        </p>
        <p className="text-sm text-graphite-soft">
          {page.fitted ? 'Fitted' : 'Not fitted yet: it has the fit it got on upload.'} Scan {page.width} × {page.height} px,{' '}
          {page.colour === 'line' ? 'line art' : page.colour === 'grey' ? 'greyscale' : 'colour'}, {page.bitsPerPixel} bit
          {page.bitsPerPixel === 1 ? '' : 's'} per pixel
          {page.ppi ? `, recorded at ${Math.round(page.ppi)} ppi` : ''}.
        </p>
        {canEdit && (
          <Button
            disabled={busy || (page.fitted && !changed)}
            onClick={async () => {
              setBusy(true);
              try {
                await onSave(fit);
                await preflight.mutate();
                setMsg('Fit saved.');
              } catch (err) {
                setMsg(messageOf(err, 'Could not save the fit.'));
              } finally {
                setBusy(false);
              }
            }}
          >
            Save fit
          </Button>
        )}
        {msg && (
          <p role="status" className="text-sm">
            {msg}
          </p>
        )}
        <div className="space-y-1" data-testid="page-preflight">
          <h3 className="text-sm font-bold text-graphite-soft">Preflight at the saved fit</h3>
          {preflight.data ? (
            <ChecksList checks={preflight.data.checks} label="Preflight of this page" />
          ) : (
            <p className="text-sm text-graphite-faint">{preflight.error ? 'The preflight could not be read.' : 'Measuring the scan…'}</p>
          )}
          <p className="text-xs text-graphite-faint">{PRINTER_FIRST}</p>
        </div>
      </div>
    </div>
  );
}
