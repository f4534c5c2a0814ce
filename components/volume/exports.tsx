'use client';
// Exports with a real progress bar: the response is read chunk by chunk against
// its Content-Length, then saved.
import { Download } from 'lucide-react';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { BlueLineForm } from './blue-line-form';

async function download(url: string, name: string, onProgress: (f: number) => void) {
  const res = await fetch(url);
  if (!res.ok) {
    const body = (await res.json().catch(() => ({}))) as { error?: string };
    throw new Error(body.error ?? `Export failed (${res.status}).`);
  }
  const total = Number(res.headers.get('content-length') ?? 0);
  const reader = res.body!.getReader();
  const chunks: Uint8Array[] = [];
  let got = 0;
  onProgress(0.05);
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    chunks.push(value);
    got += value.byteLength;
    if (total) onProgress(Math.min(0.99, got / total));
  }
  onProgress(1);
  const blob = new Blob(chunks as BlobPart[], { type: res.headers.get('content-type') ?? 'application/octet-stream' });
  const a = document.createElement('a');
  a.href = URL.createObjectURL(blob);
  a.download = name;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(a.href), 10_000);
}

export function Exports({ volumeId, entriesKey }: { volumeId: string; entriesKey: string }) {
  const [progress, setProgress] = useState<number | null>(null);
  const [which, setWhich] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [withScans, setWithScans] = useState(false);
  const run = async (label: string, url: string, name: string) => {
    setError(null);
    setWhich(label);
    setProgress(0);
    try {
      await download(url, name, setProgress);
    } catch (err) {
      setError(err instanceof Error ? err.message : 'Export failed.');
    } finally {
      setTimeout(() => setProgress(null), 800);
    }
  };
  return (
    <section aria-labelledby="exports-title" className="space-y-3">
      <h2 id="exports-title" className="text-xl font-extrabold">
        Exports
      </h2>
      <div className="flex flex-wrap items-end gap-3">
        <Button
          onClick={() =>
            void run(
              'Review dummy',
              `/api/volumes/${volumeId}/export/review.pdf${withScans ? '?lightbox=1' : ''}`,
              withScans ? 'review-dummy-with-scans.pdf' : 'review-dummy.pdf',
            )
          }
          disabled={progress !== null}
        >
          <Download aria-hidden className="h-4 w-4" /> Review dummy (PDF)
        </Button>
        <label className="inline-flex items-center gap-1 pb-2 text-sm">
          <input type="checkbox" checked={withScans} onChange={(e) => setWithScans(e.target.checked)} /> with lightbox scans under the strokes
        </label>
        <Button
          variant="secondary"
          disabled={progress !== null}
          onClick={() => void run('Running order', `/api/volumes/${volumeId}/export/running-order.csv`, 'running-order.csv')}
        >
          <Download aria-hidden className="h-4 w-4" /> Running order (CSV)
        </Button>
      </div>
      <BlueLineForm
        volumeId={volumeId}
        entriesKey={entriesKey}
        busy={progress !== null}
        onDownload={(url, name) => void run('Blue-line sheets', url, name)}
      />
      {progress !== null && (
        <div>
          <p className="text-sm">{which}…</p>
          <progress className="w-full max-w-md" max={1} value={progress} aria-label={`${which} export progress`} data-testid="export-progress" />
        </div>
      )}
      {error && (
        <p role="alert" className="text-sm text-stamp">
          {error}
        </p>
      )}
      <p className="text-xs text-graphite-faint">
        Print advice is guidance: the printer&apos;s own specification takes precedence, and every PDF says so. The running order&apos;s CSV is data
        only: a header line (page, kind, title, status, gag_id), then one row a page.
      </p>
    </section>
  );
}
