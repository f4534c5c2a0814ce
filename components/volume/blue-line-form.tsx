'use client';
// Blue-line sheets for the drawing desk: which gags (the ready ones by default), at which
// size on which paper (only what fits, or tiled), with the guide's colour and strength.
import { Download } from 'lucide-react';
import { useEffect, useState } from 'react';
import useSWR from 'swr';
import { Button } from '@/components/ui/button';
import { fetcher } from '@/lib/http/client';
import { type GuideColour, type SheetChoiceGag, type SheetSize, sizeLabel } from '@/lib/print/sheets';

export type SheetOffer = {
  sizes: SheetSize[];
  guides: GuideColour[];
  strength: { min: number; max: number; default: number };
  gags: SheetChoiceGag[];
  defaults: string[];
};

const GUIDE_WORDS: Record<GuideColour, string> = { blue: 'Light blue (drops out of scans and copies)', grey: 'Grey' };
const sizeKey = (s: SheetSize) => `${s.scale}-${s.paper}`;

export function BlueLineForm({
  volumeId,
  entriesKey,
  busy,
  onDownload,
}: {
  volumeId: string;
  /** Changes whenever the running order does, so the offer is read again. */
  entriesKey: string;
  busy: boolean;
  onDownload: (url: string, name: string) => void;
}) {
  const { data, mutate } = useSWR<SheetOffer>(`/api/volumes/${volumeId}/export/templates`, fetcher);
  useEffect(() => {
    void mutate();
  }, [entriesKey, mutate]);
  const [size, setSize] = useState<string | null>(null);
  const [guide, setGuide] = useState<GuideColour>('blue');
  const [strength, setStrength] = useState<number | null>(null);
  /** null until the person changes the choice: then the default (the ready gags) follows the data. */
  const [chosen, setChosen] = useState<string[] | null>(null);
  if (!data) return <p className="text-sm text-graphite-faint">Loading the blue-line sheet options…</p>;

  const picked = data.sizes.find((s) => sizeKey(s) === size) ?? data.sizes.find((s) => !s.tiled) ?? data.sizes[0];
  const ids = (chosen ?? data.defaults).filter((id) => data.gags.some((g) => g.gagId === id));
  const level = strength ?? data.strength.default;
  const toggle = (id: string, on: boolean) => {
    const next = new Set(ids);
    if (on) next.add(id);
    else next.delete(id);
    setChosen(data.gags.map((g) => g.gagId).filter((g) => next.has(g)));
  };
  const sheets = picked ? Math.max(1, ids.length) * picked.sheetsPerPage : 0;
  const url = picked
    ? `/api/volumes/${volumeId}/export/templates.pdf?${new URLSearchParams({
        scale: String(picked.scale),
        paper: picked.paper,
        tile: picked.tiled ? '1' : '0',
        guide,
        strength: String(level),
        gags: ids.join(','),
      })}`
    : null;

  return (
    <fieldset className="space-y-3 rounded-md border border-paper-edge p-3" aria-describedby="blue-line-help">
      <legend className="px-1 text-sm font-extrabold">Blue-line sheets for the drawing desk</legend>
      <p id="blue-line-help" className="text-xs text-graphite-soft">
        One sheet a gag: the page at your size with bleed, trim, safe area and panels, the approved pass as faint guide lines, its balloon rooms
        dashed, and the four beat notes below. A gag not ready to ink gets blank panels.
      </p>
      <div className="flex flex-wrap items-end gap-3">
        <label className="text-sm font-bold text-graphite-soft">
          Size on paper
          <select className="field mt-1 w-auto py-1.5" value={picked ? sizeKey(picked) : ''} onChange={(e) => setSize(e.target.value)}>
            {data.sizes.map((s) => (
              <option key={sizeKey(s)} value={sizeKey(s)}>
                {sizeLabel(s)}
              </option>
            ))}
          </select>
        </label>
        <label className="text-sm font-bold text-graphite-soft">
          Guide lines
          <select className="field mt-1 w-auto py-1.5" value={guide} onChange={(e) => setGuide(e.target.value as GuideColour)}>
            {data.guides.map((g) => (
              <option key={g} value={g}>
                {GUIDE_WORDS[g]}
              </option>
            ))}
          </select>
        </label>
        <label className="text-sm font-bold text-graphite-soft">
          Strength <output className="font-normal">{level} %</output>
          <input
            type="range"
            className="mt-1 block"
            min={data.strength.min}
            max={data.strength.max}
            step={10}
            value={level}
            onChange={(e) => setStrength(Number(e.target.value))}
          />
        </label>
      </div>
      <fieldset>
        <legend className="text-sm font-bold text-graphite-soft">Gags ({ids.length} chosen; the ones ready to ink at first)</legend>
        {data.gags.length === 0 && <p className="text-sm text-graphite-faint">No gags in the running order yet: you get one blank sheet.</p>}
        <ul className="mt-1 grid gap-1 sm:grid-cols-2">
          {data.gags.map((g) => (
            <li key={g.gagId}>
              <label className="inline-flex items-start gap-2 text-sm">
                <input type="checkbox" className="mt-1" checked={ids.includes(g.gagId)} onChange={(e) => toggle(g.gagId, e.target.checked)} />
                <span>
                  p. {g.page} · {g.title}{' '}
                  <span className="text-graphite-faint">
                    {g.approved ? `— pass ${g.approved.passNumber}, approved by ${g.approved.by}` : '— not ready to ink: blank panels'}
                  </span>
                </span>
              </label>
            </li>
          ))}
        </ul>
      </fieldset>
      <div className="flex flex-wrap items-center gap-3">
        <Button
          variant="secondary"
          disabled={busy || !url}
          onClick={() => url && picked && onDownload(url, `blue-lines-${picked.scale}-${picked.paper}.pdf`)}
        >
          <Download aria-hidden className="h-4 w-4" /> Blue-line sheets (PDF)
        </Button>
        <span className="text-sm text-graphite-soft" data-testid="blue-line-count">
          {ids.length === 0 ? 'No gag chosen: one blank template' : `${sheets} ${sheets === 1 ? 'sheet' : 'sheets'}`}
          {picked?.tiled ? `, each page cut across ${picked.sheetsPerPage} with overlap marks` : ''}
        </span>
      </div>
    </fieldset>
  );
}
