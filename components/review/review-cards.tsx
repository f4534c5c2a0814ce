'use client';
// The computed findings and the stamp for one pass (the checklist: checklist-card.tsx).
import { AlertTriangle, CheckCircle2, Stamp } from 'lucide-react';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { useFindings, useStamps } from '@/hooks/use-review';
import { BEAT_KINDS, BEAT_LABELS } from '@/lib/gags/status';
import { messageOf } from '@/lib/http/client';
import { redFindings } from '@/lib/review/finding-words';
import type { StampDecision } from '@/lib/review/words';

export function FindingsCard({ passId, seq }: { passId: string; seq?: number }) {
  const { data } = useFindings(passId, seq);
  if (!data) return <section className="panel p-4 text-sm text-graphite-faint">Measuring the pass…</section>;
  const pct = (n: number) => `${Math.round(n * 100)}%`;
  return (
    <section className="panel p-4" aria-labelledby={`findings-${passId}`}>
      <h3 id={`findings-${passId}`} className="mb-2 text-lg font-extrabold">
        Findings
      </h3>
      <table className="w-full text-sm" data-testid="findings">
        <thead>
          <tr className="text-left text-xs text-graphite-faint">
            <th className="py-1 font-normal">Panel</th>
            <th className="py-1 font-normal">Ink load</th>
            <th className="py-1 font-normal">In balloon rooms</th>
            <th className="py-1 font-normal">Past safe area</th>
          </tr>
        </thead>
        <tbody>
          {data.panels.map((p) => (
            <tr key={p.panel} className="border-t border-paper-edge/60">
              <th scope="row" className="py-1 text-left font-bold">
                {p.panel + 1} {BEAT_LABELS[BEAT_KINDS[p.panel]!]}
                {p.empty && <span className="ml-1 rounded bg-stamp-light px-1 text-xs font-normal text-stamp">empty</span>}
              </th>
              <td className={p.inkHeavy ? 'font-bold text-stamp' : ''}>
                {pct(p.inkLoad)}
                {p.inkHeavy && <span className="ml-1 text-xs">(over {pct(data.inkThreshold)}: cluttered?)</span>}
              </td>
              <td className={p.roomIntrusions ? 'font-bold text-stamp' : ''}>
                {p.roomIntrusions ? `${p.roomIntrusions} stroke${p.roomIntrusions === 1 ? '' : 's'}` : '—'}
              </td>
              <td className={p.outsideSafe ? 'font-bold text-stamp' : ''}>
                {p.outsideSafe ? `${p.outsideSafe} stroke${p.outsideSafe === 1 ? '' : 's'}` : '—'}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {data.beatsMissing.length > 0 ? (
        <p className="mt-2 inline-flex items-center gap-1 text-sm text-stamp">
          <AlertTriangle aria-hidden className="h-4 w-4" /> Beats without a note: {data.beatsMissing.map((k) => BEAT_LABELS[k]).join(', ')}
        </p>
      ) : (
        <p className="mt-2 inline-flex items-center gap-1 text-sm text-graphite-soft">
          <CheckCircle2 aria-hidden className="h-4 w-4" /> Every beat has a note.
        </p>
      )}
    </section>
  );
}

/**
 * The stamp. "Ready to ink" while findings show in red asks first, naming them: the findings are
 * advice (an empty panel may be meant), the stamp is the editor's call — but not by a slip.
 */
export function StampCard({
  gagId,
  passId,
  passNumber,
  seq,
  canStamp,
}: {
  gagId: string;
  passId: string;
  passNumber: number;
  seq?: number;
  canStamp: boolean;
}) {
  const { data, stamp } = useStamps(gagId);
  const { data: findings, error: findingsError } = useFindings(canStamp ? passId : null, seq);
  // Until the findings are measured there is nothing to confirm against: wait for them (not if they failed).
  const measuring = canStamp && !findings && !findingsError;
  const [note, setNote] = useState('');
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [asking, setAsking] = useState<string[] | null>(null);
  const red = findings ? redFindings(findings) : [];
  const mine = (data ?? []).filter((s) => s.passId === passId);
  const current = mine[0];
  const act = async (decision: StampDecision) => {
    setBusy(true);
    setError(null);
    try {
      await stamp(passId, decision, note);
      setNote('');
    } catch (err) {
      setError(messageOf(err, 'Could not stamp.'));
    } finally {
      setBusy(false);
    }
  };
  return (
    <section className="panel p-4" aria-labelledby={`stamp-${passId}`}>
      <h3 id={`stamp-${passId}`} className="mb-2 inline-flex items-center gap-1.5 text-lg font-extrabold">
        <Stamp aria-hidden className="h-5 w-5" /> Stamp
      </h3>
      {current ? (
        <div
          data-testid="current-stamp"
          className={`rounded-md border-2 px-3 py-2 ${current.decision === 'ready' && !current.clearedAt ? 'border-ready bg-ready-light text-ready' : 'border-paper-edge text-graphite-soft'}`}
        >
          <p className="font-bold">
            {current.decision === 'ready' ? 'Ready to ink' : 'Needs another pass'}
            {current.clearedAt ? ' — cleared: the pass changed after it' : ''}
          </p>
          <p className="text-sm" suppressHydrationWarning>
            {current.by}, pass {current.passNumber} at #{current.passSeq}, {new Date(current.createdAt).toLocaleString()}
          </p>
          {current.note && <p className="mt-1 text-sm">“{current.note}”</p>}
        </div>
      ) : (
        <p className="text-sm text-graphite-soft">Pass {passNumber} has not been stamped.</p>
      )}
      {canStamp && (
        <div className="mt-3 space-y-2">
          <label className="block text-sm font-bold text-graphite-soft">
            Note for the stamp
            <textarea className="field mt-1" rows={2} value={note} onChange={(e) => setNote(e.target.value)} maxLength={1000} />
          </label>
          <div className="flex flex-wrap gap-2">
            <Button variant="stamp" disabled={busy || measuring} onClick={() => (red.length ? setAsking(red) : void act('ready'))}>
              Stamp “ready to ink”
            </Button>
            <Button variant="secondary" disabled={busy} onClick={() => void act('again')}>
              Needs another pass
            </Button>
          </div>
          {error && (
            <p role="alert" className="text-sm text-stamp">
              {error}
            </p>
          )}
          <ConfirmDialog
            open={asking !== null}
            title={`Stamp pass ${passNumber} “ready to ink” over ${asking?.length === 1 ? 'a finding' : `${asking?.length ?? 0} findings`}?`}
            body={
              <>
                <ul className="list-disc space-y-1 pl-5 text-sm" data-testid="stamp-findings">
                  {(asking ?? []).map((f) => (
                    <li key={f}>{f}</li>
                  ))}
                </ul>
                <p className="mt-2 text-sm">The findings are advice; the stamp is yours to give.</p>
              </>
            }
            confirmLabel="Stamp “ready to ink” anyway"
            busy={busy}
            onCancel={() => setAsking(null)}
            onConfirm={() => {
              setAsking(null);
              void act('ready');
            }}
          />
        </div>
      )}
    </section>
  );
}
