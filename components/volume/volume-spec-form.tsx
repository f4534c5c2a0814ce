'use client';
// The volume's print spec: trim (presets or custom), bleed, safe, gutter, binding, caliper, direction.
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { BLEED_PRESETS, CONFIRM_WITH_PRINTER, TRIM_PRESETS, type VolumeSpec, bookSpineMm } from '@/lib/print/book';
import { counted } from '@/lib/counted';

function NumberField(p: { label: string; step: string; value: number; onChange: (e: React.ChangeEvent<HTMLInputElement>) => void }) {
  return (
    <label className="text-sm font-bold text-graphite-soft">
      {p.label}
      <input type="number" step={p.step} className="field mt-1 py-1.5" value={p.value} onChange={p.onChange} />
    </label>
  );
}

export function VolumeSpecForm({
  spec,
  pages,
  canEdit,
  onSave,
}: {
  spec: VolumeSpec;
  pages: number;
  canEdit: boolean;
  onSave: (spec: Partial<VolumeSpec>) => Promise<void>;
}) {
  const [s, setS] = useState(spec);
  const [msg, setMsg] = useState<string | null>(null);
  const preset =
    Object.entries(TRIM_PRESETS).find(([, p]) => Math.abs(p.trimW - s.trimW) < 0.01 && Math.abs(p.trimH - s.trimH) < 0.01)?.[0] ?? 'custom';
  const num = (k: keyof VolumeSpec) => (e: React.ChangeEvent<HTMLInputElement>) => setS({ ...s, [k]: Number(e.target.value) });
  return (
    <section aria-labelledby="spec-title" className="space-y-3">
      <h2 id="spec-title" className="text-xl font-extrabold">
        Print spec
      </h2>
      <fieldset disabled={!canEdit} className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <label className="text-sm font-bold text-graphite-soft">
          Trim size
          <select
            className="field mt-1 py-1.5"
            value={preset}
            onChange={(e) => {
              const p = TRIM_PRESETS[e.target.value as keyof typeof TRIM_PRESETS];
              if (p) setS({ ...s, trimW: p.trimW, trimH: p.trimH });
            }}
          >
            {Object.entries(TRIM_PRESETS).map(([k, p]) => (
              <option key={k} value={k}>
                {p.label}
              </option>
            ))}
            <option value="custom">Custom</option>
          </select>
        </label>
        <NumberField label="Width (mm)" step="0.1" value={s.trimW} onChange={num('trimW')} />
        <NumberField label="Height (mm)" step="0.1" value={s.trimH} onChange={num('trimH')} />
        <label className="text-sm font-bold text-graphite-soft">
          Bleed
          <select
            className="field mt-1 py-1.5"
            value={Math.abs(s.bleed - BLEED_PRESETS.in8) < 0.001 ? 'in8' : 'mm3'}
            onChange={(e) => setS({ ...s, bleed: BLEED_PRESETS[e.target.value as 'mm3' | 'in8'] })}
          >
            <option value="mm3">3 mm</option>
            <option value="in8">1/8 in (3.175 mm)</option>
          </select>
        </label>
        <NumberField label="Safe margin (mm)" step="0.5" value={s.safe} onChange={num('safe')} />
        <NumberField label="Gutter (mm)" step="0.5" value={s.gutter} onChange={num('gutter')} />
        <label className="text-sm font-bold text-graphite-soft">
          Binding
          <select className="field mt-1 py-1.5" value={s.binding} onChange={(e) => setS({ ...s, binding: e.target.value as VolumeSpec['binding'] })}>
            <option value="saddle">Saddle stitched</option>
            <option value="perfect">Perfect bound</option>
          </select>
        </label>
        <NumberField label="Paper caliper (µm)" step="5" value={s.caliperUm} onChange={num('caliperUm')} />
        <label className="text-sm font-bold text-graphite-soft">
          Reading direction
          <select
            className="field mt-1 py-1.5"
            value={s.direction}
            onChange={(e) => setS({ ...s, direction: e.target.value as VolumeSpec['direction'] })}
          >
            <option value="ltr">Left to right</option>
            <option value="rtl">Right to left</option>
          </select>
        </label>
      </fieldset>
      <p className="text-sm text-graphite-soft">
        {s.binding === 'perfect'
          ? `Spine at ${counted(pages, 'page')}: ${bookSpineMm(pages, s.binding, s.caliperUm)!.toFixed(2)} mm (pages ÷ 2 × paper caliper).`
          : 'Saddle stitched: folded and stapled, no spine.'}{' '}
        {CONFIRM_WITH_PRINTER}
      </p>
      {canEdit && (
        <Button
          onClick={async () => {
            setMsg(null);
            try {
              await onSave(s);
              setMsg('Print spec saved.');
            } catch (err) {
              setMsg(err instanceof Error ? err.message : 'Could not save.');
            }
          }}
        >
          Save print spec
        </Button>
      )}
      {msg && (
        <p role="status" className="text-sm">
          {msg}
        </p>
      )}
    </section>
  );
}
