'use client';
// A gag's (or a matter page's) final page: upload the scan of the inked page with a
// progress bar, fit it to the page with the live view, and the earlier scans with
// who sent them and when, any of which can be made current again.
import { Upload } from 'lucide-react';
import { useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import type { FinalPageDto } from '@/db/queries/final-pages';
import { useFinalPages } from '@/hooks/use-final-pages';
import { messageOf } from '@/lib/http/client';
import type { PageSpec } from '@/lib/print/geometry';
import { FitEditor } from './fit-editor';
import { sendFile } from './send-file';

export const ACCEPT_SCANS = 'image/tiff,image/png,image/jpeg,.tif,.tiff';

const when = (iso: string) => new Date(iso).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

export function FinalPagePanel({
  title,
  listUrl,
  spec,
  canEdit,
  headingLevel = 2,
}: {
  title: string;
  listUrl: string;
  spec: PageSpec;
  canEdit: boolean;
  headingLevel?: 2 | 3;
}) {
  const { data: pages, current, fit, makeCurrent, mutate } = useFinalPages(listUrl);
  const input = useRef<HTMLInputElement>(null);
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  const saved = useState<string | null>(null);
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  const headingId = `final-${listUrl.replace(/[^a-z0-9]/gi, '-')}`;

  async function upload(file: File) {
    setError(null);
    setProgress(0);
    try {
      await sendFile<FinalPageDto>(listUrl, file, setProgress);
      await mutate();
    } catch (err) {
      setError(err instanceof Error ? err.message : 'Upload failed.');
    } finally {
      setProgress(null);
    }
  }

  return (
    <section aria-labelledby={headingId} className="space-y-3" data-testid="final-page-panel">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <Heading id={headingId} className={headingLevel === 2 ? 'text-xl font-extrabold' : 'text-lg font-bold'}>
          {title}
        </Heading>
        {canEdit && (
          <>
            <input
              ref={input}
              type="file"
              accept={ACCEPT_SCANS}
              className="sr-only"
              aria-label="Final page scan (TIFF, PNG or JPEG)"
              onChange={(e) => {
                const file = e.target.files?.[0];
                e.target.value = '';
                if (file) void upload(file);
              }}
            />
            <Button variant="secondary" disabled={progress !== null} onClick={() => input.current?.click()}>
              <Upload aria-hidden className="h-4 w-4" /> {current ? 'Replace the final page' : 'Upload the final page'}
            </Button>
          </>
        )}
      </div>
      {progress !== null && <progress max={1} value={progress} aria-label="Uploading the final page" className="w-64" />}
      {error && (
        <p role="alert" className="text-sm text-stamp">
          {error}
        </p>
      )}
      {!pages ? (
        <p className="text-sm text-graphite-faint">Loading…</p>
      ) : !current ? (
        <p className="text-sm text-graphite-soft">
          No final page yet: the scan of the inked, toned page (TIFF, PNG or JPEG, kept at its own pixels) goes here.
        </p>
      ) : (
        <FitEditor
          key={`${current.id}:${JSON.stringify(current.fit)}`}
          page={current}
          spec={spec}
          canEdit={canEdit}
          onSave={(f) => fit(current.id, f)}
          message={saved}
        />
      )}
      {pages && pages.length > 1 && (
        <details className="text-sm">
          <summary className="cursor-pointer font-bold text-graphite-soft">Earlier scans ({pages.length - 1})</summary>
          <ul className="mt-2 space-y-2" aria-label="Final pages, newest first">
            {pages.map((p) => (
              <li key={p.id} className="flex items-center gap-3">
                {/* eslint-disable-next-line @next/next/no-img-element -- a private preview from our own route */}
                <img src={`/api/final-pages/${p.id}/image/preview`} alt="" className="h-12 w-12 border border-paper-edge object-contain" />
                <span className="flex-1">
                  <strong>{p.name}</strong> · {p.width} × {p.height} px · sent by {p.by}, {when(p.createdAt)}
                  {p.current && (
                    <>
                      {' '}
                      · current since {when(p.madeCurrentAt)} ({p.madeCurrentBy})
                    </>
                  )}
                </span>
                {p.current ? (
                  <span className="rounded bg-ink-light px-2 py-0.5 text-xs font-bold text-ink">Current</span>
                ) : (
                  canEdit && (
                    <Button
                      variant="ghost"
                      onClick={() => void makeCurrent(p.id).catch((err) => setError(messageOf(err, 'Could not go back to it.')))}
                      aria-label={`Use ${p.name} again`}
                    >
                      Use this one
                    </Button>
                  )
                )}
              </li>
            ))}
          </ul>
        </details>
      )}
    </section>
  );
}
