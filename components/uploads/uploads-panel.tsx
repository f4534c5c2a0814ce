'use client';
// Scans and photos of paper thumbnails: pick or drop several files, each with
// a real progress bar (XHR upload progress), and a clear message on failure.
import { ImagePlus, Trash2 } from 'lucide-react';
import { useCallback, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import type { UploadListItem } from '@/db/queries/uploads';
import { useUploads } from '@/hooks/use-uploads';
import { ApiError, messageOf } from '@/lib/http/client';
import { ImageFilesInput, UploadJobList, useUploadJobs } from './upload-jobs';

export function UploadsPanel({ seriesId, canUpload }: { seriesId: string; canUpload: boolean }) {
  const { data, mutate, remove } = useUploads(seriesId);
  const [over, setOver] = useState(false);
  const [confirm, setConfirm] = useState<UploadListItem | null>(null);
  const input = useRef<HTMLInputElement>(null);
  const { jobs, start } = useUploadJobs(
    seriesId,
    useCallback(() => void mutate(), [mutate]),
  );

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
          <ImageFilesInput ref={input} label="Upload scans or photos" onFiles={start} />
        </div>
      )}
      <UploadJobList jobs={jobs} />
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
            {u.passesUsing > 0 && (
              <p className="text-graphite-soft">
                Lightbox of {u.passesUsing} pass{u.passesUsing === 1 ? '' : 'es'}
              </p>
            )}
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
        body={
          <>
            “{confirm?.name}” will be removed from the series.
            {confirm && confirm.passesUsing > 0 && (
              <strong className="mt-2 block text-stamp">
                It is still the lightbox of {confirm.passesUsing} pass{confirm.passesUsing === 1 ? '' : 'es'}; they will show an empty frame where it
                was.
              </strong>
            )}
          </>
        }
        confirmLabel="Delete upload"
        onCancel={() => setConfirm(null)}
        onConfirm={async () => {
          if (!confirm) return;
          try {
            // Only a dialog that said which passes use it may delete a used upload;
            // if one started using it since the list loaded, the server says so (409) and we ask again.
            await remove(confirm.id, confirm.passesUsing > 0);
          } catch (err) {
            if (err instanceof ApiError && err.status === 409) {
              const usedBy = (await mutate())?.find((u) => u.id === confirm.id);
              setConfirm(usedBy ?? null);
              return;
            }
            alert(messageOf(err, 'Could not delete.'));
          }
          setConfirm(null);
          await mutate();
        }}
      />
    </section>
  );
}
