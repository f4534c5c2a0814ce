'use client';
// Scans and photos of paper thumbnails: pick or drop several files, each with
// a real progress bar (XHR upload progress), and a clear message on failure.
import { ImagePlus, Trash2 } from 'lucide-react';
import { useRef, useState } from 'react';
import useSWR from 'swr';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import type { UploadDto } from '@/db/queries/uploads';
import { ApiError, api, fetcher } from '@/lib/http/client';

type Job = { key: string; name: string; progress: number; error: string | null; done: boolean };

function send(seriesId: string, file: File, onProgress: (f: number) => void): Promise<UploadDto> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/series/${seriesId}/uploads`);
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded / e.total);
    };
    xhr.onload = () => {
      let body: { error?: string } & Partial<UploadDto> = {};
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        /* not JSON */
      }
      if (xhr.status >= 200 && xhr.status < 300) resolve(body as UploadDto);
      else reject(new Error(body.error ?? `Upload failed (${xhr.status}).`));
    };
    xhr.onerror = () => reject(new Error('The connection was lost during the upload.'));
    const form = new FormData();
    form.append('file', file);
    xhr.send(form);
  });
}

export function UploadsPanel({ seriesId, canUpload }: { seriesId: string; canUpload: boolean }) {
  const { data, mutate } = useSWR<UploadDto[]>(`/api/series/${seriesId}/uploads`, fetcher);
  const [jobs, setJobs] = useState<Job[]>([]);
  const [over, setOver] = useState(false);
  const [confirm, setConfirm] = useState<UploadDto | null>(null);
  const input = useRef<HTMLInputElement>(null);

  const start = (files: FileList | File[]) => {
    for (const file of Array.from(files)) {
      const key = `${file.name}-${file.size}-${Math.random()}`;
      setJobs((j) => [...j, { key, name: file.name, progress: 0, error: null, done: false }]);
      const update = (patch: Partial<Job>) => setJobs((j) => j.map((x) => (x.key === key ? { ...x, ...patch } : x)));
      send(seriesId, file, (p) => update({ progress: p }))
        .then(() => {
          update({ progress: 1, done: true });
          void mutate();
        })
        .catch((err: Error) => update({ error: err.message }));
    }
  };

  return (
    <section aria-labelledby="uploads-title" className="space-y-3">
      <h2 id="uploads-title" className="text-xl font-extrabold">
        Scans and photos
      </h2>
      {canUpload && (
        <div
          onDragOver={(e) => {
            e.preventDefault();
            setOver(true);
          }}
          onDragLeave={() => setOver(false)}
          onDrop={(e) => {
            e.preventDefault();
            setOver(false);
            if (e.dataTransfer.files.length) start(e.dataTransfer.files);
          }}
          className={`flex flex-wrap items-center gap-3 rounded-lg border-2 border-dashed p-4 ${over ? 'border-ink bg-ink-light' : 'border-paper-edge'}`}
          data-testid="upload-drop"
        >
          <ImagePlus aria-hidden className="h-6 w-6 text-graphite-faint" />
          <p className="text-sm text-graphite-soft">Drop PNG, JPEG or WebP scans here (up to 25 MB each), or</p>
          <Button variant="secondary" onClick={() => input.current?.click()}>
            Choose files
          </Button>
          <input
            ref={input}
            type="file"
            accept="image/png,image/jpeg,image/webp"
            multiple
            className="sr-only"
            aria-label="Upload scans or photos"
            onChange={(e) => {
              if (e.target.files?.length) start(e.target.files);
              e.target.value = '';
            }}
          />
        </div>
      )}
      {jobs.length > 0 && (
        <ul className="space-y-1 text-sm" aria-label="Uploads in progress">
          {jobs.map((j) => (
            <li key={j.key} className="flex items-center gap-2">
              <span className="w-48 truncate">{j.name}</span>
              {j.error ? (
                <span role="alert" className="text-stamp">
                  {j.error}
                </span>
              ) : (
                <>
                  <progress max={1} value={j.progress} aria-label={`Uploading ${j.name}`} className="w-48" data-testid="upload-progress" />
                  <span className="text-graphite-faint">{j.done ? 'Done' : `${Math.round(j.progress * 100)}%`}</span>
                </>
              )}
            </li>
          ))}
        </ul>
      )}
      <ul className="flex flex-wrap gap-3" data-testid="uploads">
        {(data ?? []).map((u) => (
          <li key={u.id} className="panel w-40 p-2 text-xs">
            {/* eslint-disable-next-line @next/next/no-img-element -- served by our own route after a role check */}
            <img src={`/api/uploads/${u.id}/preview`} alt={u.name} className="aspect-square w-full rounded bg-white object-contain" />
            <p className="mt-1 truncate font-bold" title={u.name}>
              {u.name}
            </p>
            <p className="text-graphite-faint">
              {u.width} × {u.height} px · {(u.bytes / 1024).toFixed(0)} kB
            </p>
            {canUpload && (
              <button type="button" className="mt-1 inline-flex items-center gap-1 text-stamp hover:underline" onClick={() => setConfirm(u)}>
                <Trash2 aria-hidden className="h-3 w-3" /> Delete
              </button>
            )}
          </li>
        ))}
      </ul>
      <ConfirmDialog
        open={!!confirm}
        title="Delete this upload?"
        body={<>“{confirm?.name}” will be removed from the series.</>}
        confirmLabel="Delete upload"
        onCancel={() => setConfirm(null)}
        onConfirm={async () => {
          if (!confirm) return;
          try {
            await api(`/api/uploads/${confirm.id}`, { method: 'DELETE' });
          } catch (err) {
            alert(err instanceof ApiError ? err.message : 'Could not delete.');
          }
          setConfirm(null);
          await mutate();
        }}
      />
    </section>
  );
}
