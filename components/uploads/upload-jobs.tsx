'use client';
// Sending scans and photos, one request per file, each with a real progress
// bar (XHR upload progress events) and a clear message on failure. Used on the
// gag page and in the editor.
import { forwardRef, useCallback, useState } from 'react';
import type { UploadDto } from '@/db/queries/uploads';

export type UploadJob = { key: string; name: string; progress: number; error: string | null; done: boolean };

export const ACCEPT_IMAGES = 'image/png,image/jpeg,image/webp';

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

/** Starts uploads; `onUploaded` runs for each file the server accepted. */
export function useUploadJobs(seriesId: string, onUploaded: (u: UploadDto, index: number) => void) {
  const [jobs, setJobs] = useState<UploadJob[]>([]);
  const start = useCallback(
    (files: FileList | File[]) => {
      Array.from(files).forEach((file, index) => {
        const key = `${file.name}-${file.size}-${Math.random()}`;
        setJobs((j) => [...j, { key, name: file.name, progress: 0, error: null, done: false }]);
        const update = (patch: Partial<UploadJob>) => setJobs((j) => j.map((x) => (x.key === key ? { ...x, ...patch } : x)));
        send(seriesId, file, (p) => update({ progress: p }))
          .then((u) => {
            update({ progress: 1, done: true });
            onUploaded(u, index);
          })
          .catch((err: Error) => update({ error: err.message }));
      });
    },
    [seriesId, onUploaded],
  );
  return { jobs, start };
}

export function UploadJobList({ jobs, narrow = false }: { jobs: UploadJob[]; narrow?: boolean }) {
  if (jobs.length === 0) return null;
  return (
    <ul className="space-y-1 text-sm" aria-label="Uploads in progress">
      {jobs.map((j) => (
        <li key={j.key} className={narrow ? 'space-y-0.5' : 'flex items-center gap-2'}>
          <span className={`block truncate ${narrow ? '' : 'w-48'}`}>{j.name}</span>
          {j.error ? (
            <span role="alert" className="text-stamp">
              {j.error}
            </span>
          ) : (
            <span className="flex items-center gap-2">
              <progress
                max={1}
                value={j.progress}
                aria-label={`Uploading ${j.name}`}
                className={narrow ? 'w-40' : 'w-48'}
                data-testid="upload-progress"
              />
              <span className="text-graphite-faint">{j.done ? 'Done' : `${Math.round(j.progress * 100)}%`}</span>
            </span>
          )}
        </li>
      ))}
    </ul>
  );
}

/** The hidden multi-file picker for images; a visible button clicks it. */
export const ImageFilesInput = forwardRef<HTMLInputElement, { label: string; onFiles: (files: FileList) => void }>(function ImageFilesInput(
  { label, onFiles },
  ref,
) {
  return (
    <input
      ref={ref}
      type="file"
      accept={ACCEPT_IMAGES}
      multiple
      className="sr-only"
      aria-label={label}
      onChange={(e) => {
        if (e.target.files?.length) onFiles(e.target.files);
        e.target.value = '';
      }}
    />
  );
});
