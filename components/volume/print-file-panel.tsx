'use client';
// The print file and the cover file: start a job, follow its progress (the job's row,
// the same on every server), download the file when it is in storage. While pages lack
// their scans the server answers with the list; the owner may ask for a proof instead.
import { Download, Printer } from 'lucide-react';
import { useState } from 'react';
import useSWR from 'swr';
import { Button } from '@/components/ui/button';
import type { PrintJobDto } from '@/db/queries/print-jobs';
import { fetcher } from '@/lib/http/client';
import { CONFIRM_WITH_PRINTER } from '@/lib/print/book';

const FILE_NAMES = { print: 'print file', cover: 'cover file' } as const;
const mb = (bytes: number | null) => `${((bytes ?? 0) / 1048576).toFixed(1)} MB`;
const active = (j: PrintJobDto) => j.state === 'queued' || j.state === 'running';

function JobLine({ job }: { job: PrintJobDto }) {
  const name = `${job.proof ? 'Proof of the ' : 'The '}${FILE_NAMES[job.kind]}`;
  if (active(job)) {
    return (
      <div className="space-y-1" data-testid="print-job" data-state={job.state}>
        <p className="text-sm" aria-live="polite">
          {name}: {job.stage}…
        </p>
        <progress
          className="w-full max-w-md"
          max={Math.max(1, job.total)}
          value={job.total ? job.done : undefined}
          aria-label={`${name}: progress`}
          data-testid="print-progress"
        />
      </div>
    );
  }
  if (job.state === 'failed') {
    return (
      <p role="alert" className="text-sm text-stamp" data-testid="print-job" data-state="failed">
        {name} failed: {job.message}
      </p>
    );
  }
  if (!job.file) {
    return (
      <p className="text-sm text-graphite-faint" data-testid="print-job" data-state="replaced">
        {name}, built by {job.by} {new Date(job.finishedAt ?? job.createdAt).toLocaleString()}: replaced by a newer file.
      </p>
    );
  }
  return (
    <div className="space-y-1" data-testid="print-job" data-state="done">
      <a
        href={job.file}
        download
        className="inline-flex items-center gap-1.5 rounded-md border border-paper-edge bg-white px-3 py-2 text-sm font-bold hover:bg-paper-deep"
      >
        <Download aria-hidden className="h-4 w-4" /> {name} ({job.pages} {job.pages === 1 ? 'page' : 'pages'}, {mb(job.bytes)})
      </a>
      <p className="text-xs text-graphite-faint">
        Built by {job.by}, {new Date(job.finishedAt ?? job.createdAt).toLocaleString()}.
      </p>
      {job.notes.length > 0 && (
        <ul className="list-disc pl-5 text-xs text-graphite-soft">
          {job.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      )}
    </div>
  );
}

export function PrintFilePanel({
  volumeId,
  binding,
  canPrint,
  canProof,
}: {
  volumeId: string;
  binding: 'saddle' | 'perfect';
  canPrint: boolean;
  canProof: boolean;
}) {
  const key = `/api/volumes/${volumeId}/print-jobs`;
  // Quick while a job runs (on this server or another); slow otherwise, to see files others built.
  const { data, mutate } = useSWR<{ jobs: PrintJobDto[] }>(key, fetcher, {
    refreshInterval: (latest) => (latest?.jobs.some(active) ? 700 : 20_000),
  });
  const [proof, setProof] = useState(false);
  const [refusal, setRefusal] = useState<{ message: string; missing: { number: number; label: string }[] } | null>(null);
  const start = async (kind: 'print' | 'cover') => {
    setRefusal(null);
    try {
      const res = await fetch(key, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ kind, proof }) });
      if (!res.ok) {
        const body = (await res.json().catch(() => ({}))) as { error?: string; missing?: { number: number; label: string }[] };
        setRefusal({ message: body.error ?? `The job could not be started (${res.status}).`, missing: body.missing ?? [] });
      }
    } catch {
      setRefusal({ message: 'The server could not be reached; try again.', missing: [] });
    }
    await mutate();
  };
  // The newest job of each kind (print, proof of print, cover, proof of cover).
  const latest = new Map<string, PrintJobDto>();
  for (const j of data?.jobs ?? []) if (!latest.has(`${j.kind}/${j.proof}`)) latest.set(`${j.kind}/${j.proof}`, j);
  const busy = [...latest.values()].some(active);
  return (
    <section aria-labelledby="print-file-title" className="space-y-3" data-testid="print-file-panel">
      <h2 id="print-file-title" className="text-xl font-extrabold">
        Print file
      </h2>
      <p className="text-sm text-graphite-soft">
        Every page at trim plus bleed, each final page at its scan&apos;s own resolution, in running order with the blanks the binding needs
        {binding === 'perfect' ? '; the cover (back, spine and front) as a separate file' : ''}. {CONFIRM_WITH_PRINTER}
      </p>
      {canPrint && (
        <div className="flex flex-wrap items-center gap-3">
          <Button onClick={() => void start('print')} disabled={busy}>
            <Printer aria-hidden className="h-4 w-4" /> Build the print file
          </Button>
          {binding === 'perfect' && (
            <Button variant="secondary" onClick={() => void start('cover')} disabled={busy}>
              <Printer aria-hidden className="h-4 w-4" /> Build the cover file
            </Button>
          )}
          {canProof && (
            <label className="inline-flex items-center gap-1 text-sm">
              <input type="checkbox" checked={proof} onChange={(e) => setProof(e.target.checked)} /> as a proof: newest passes stand in for missing
              scans, marked &ldquo;not for print&rdquo;
            </label>
          )}
        </div>
      )}
      {refusal && (
        <div role="alert" className="rounded-md border border-stamp/40 bg-stamp-light px-3 py-2 text-sm text-stamp" data-testid="print-refusal">
          <p>{refusal.message}</p>
          {refusal.missing.length > 0 && (
            <ul className="list-disc pl-5">
              {refusal.missing.map((m) => (
                <li key={m.number}>
                  Page {m.number}: {m.label}
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
      <div className="space-y-3">
        {[...latest.values()].map((j) => (
          <JobLine key={j.id} job={j} />
        ))}
      </div>
    </section>
  );
}
