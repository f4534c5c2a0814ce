'use client';
// What happened in the series, newest first, a page at a time.
import Link from 'next/link';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import type { ActivityDto } from '@/db/queries/activity';
import { olderActivity, useActivity } from '@/hooks/use-review';

export function ActivityFeed({ seriesId }: { seriesId: string }) {
  const { data } = useActivity(seriesId);
  const [older, setOlder] = useState<ActivityDto[]>([]);
  const [next, setNext] = useState<number | null | undefined>(undefined);
  const items = [...(data?.items ?? []), ...older.filter((o) => !(data?.items ?? []).some((i) => i.id === o.id))];
  const cursor = next === undefined ? data?.nextBefore : next;
  return (
    <section className="panel p-4" aria-labelledby="activity-title">
      <h2 id="activity-title" className="mb-2 text-xl font-extrabold">
        Activity
      </h2>
      {items.length === 0 && <p className="text-sm text-graphite-faint">Nothing yet.</p>}
      <ol className="space-y-1.5 text-sm" data-testid="activity">
        {items.map((a) => (
          <li key={a.id}>
            <span className="font-bold">{a.by ?? 'Someone'}</span>{' '}
            {a.gagId ? (
              <Link href={`/series/${seriesId}/gags/${a.gagId}`} className="hover:underline">
                {a.summary}
              </Link>
            ) : (
              a.summary
            )}{' '}
            <span className="text-xs text-graphite-faint" suppressHydrationWarning>
              {new Date(a.createdAt).toLocaleString()}
            </span>
          </li>
        ))}
      </ol>
      {cursor ? (
        <Button
          variant="secondary"
          className="mt-3"
          onClick={async () => {
            const page = await olderActivity(seriesId, cursor);
            setOlder((o) => [...o, ...page.items]);
            setNext(page.nextBefore);
          }}
        >
          Older activity
        </Button>
      ) : null}
    </section>
  );
}
