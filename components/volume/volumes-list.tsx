'use client';
// The series' volumes on the board, and a new one for the owner.
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { useVolumes } from '@/hooks/use-volumes';
import { messageOf } from '@/lib/http/client';

export function VolumesList({ seriesId, canCreate }: { seriesId: string; canCreate: boolean }) {
  const router = useRouter();
  const { data, create } = useVolumes(seriesId);
  const [title, setTitle] = useState('');
  const [deadline, setDeadline] = useState('');
  const [error, setError] = useState<string | null>(null);
  return (
    <section className="panel p-4" aria-labelledby="volumes-title">
      <h2 id="volumes-title" className="mb-2 text-xl font-extrabold">
        Volumes
      </h2>
      <ul className="space-y-1">
        {(data ?? []).map((v) => (
          <li key={v.id}>
            <Link href={`/series/${seriesId}/volumes/${v.id}`} className="font-bold text-ink hover:underline">
              {v.title}
            </Link>{' '}
            <span className="text-sm text-graphite-faint">due {v.deadline}</span>
          </li>
        ))}
        {data?.length === 0 && <li className="text-sm text-graphite-faint">No volume yet.</li>}
      </ul>
      {canCreate && (
        <form
          className="mt-3 flex flex-wrap items-end gap-2"
          onSubmit={async (e) => {
            e.preventDefault();
            setError(null);
            try {
              const v = await create({ title, deadline });
              router.push(`/series/${seriesId}/volumes/${v.id}`);
            } catch (err) {
              setError(messageOf(err, 'Could not create the volume.'));
            }
          }}
        >
          <label className="text-sm font-bold text-graphite-soft">
            Volume title
            <input className="field mt-1 w-48 py-1.5" value={title} onChange={(e) => setTitle(e.target.value)} />
          </label>
          <label className="text-sm font-bold text-graphite-soft">
            Volume deadline
            <input type="date" className="field mt-1 w-auto py-1.5" value={deadline} onChange={(e) => setDeadline(e.target.value)} />
          </label>
          <Button type="submit">New volume</Button>
          {error && (
            <p role="alert" className="w-full text-sm text-stamp">
              {error}
            </p>
          )}
        </form>
      )}
    </section>
  );
}
