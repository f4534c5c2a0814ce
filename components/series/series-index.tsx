'use client';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import type { SeriesDto } from '@/db/queries/series';
import { useSeriesList } from '@/hooks/use-series-list';
import { ROLE_LABELS } from '@/lib/auth/permissions';
import { messageOf } from '@/lib/http/client';
import type { CreateSeriesInput } from '@/lib/validation/series';
import { lazyZodResolver } from '@/lib/forms/lazy-resolver';

export function SeriesIndex({ initial }: { initial: SeriesDto[] }) {
  const router = useRouter();
  const { data, createSeries } = useSeriesList(initial);
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, formState, reset } = useForm<CreateSeriesInput>({
    resolver: lazyZodResolver(() => import('@/lib/validation/series').then((m) => m.createSeriesSchema)),
  });
  const onSubmit = handleSubmit(async ({ title }) => {
    setError(null);
    try {
      const created = await createSeries(title);
      reset();
      router.push(`/series/${created.id}`);
    } catch (err) {
      setError(messageOf(err, 'Could not create the series.'));
    }
  });
  const list = data ?? [];
  return (
    <div className="grid gap-8 lg:grid-cols-[2fr_1fr]">
      <section aria-labelledby="my-series">
        <h1 id="my-series" className="text-3xl font-extrabold">
          My series
        </h1>
        {list.length === 0 ? (
          <p className="mt-4 text-graphite-soft">You are not in any series yet. Start one, or ask an owner to invite you.</p>
        ) : (
          <ul className="mt-4 grid gap-3 sm:grid-cols-2">
            {list.map((s) => (
              <li key={s.id}>
                <Link href={`/series/${s.id}`} className="panel block p-4 transition-colors hover:border-ink focus-visible:border-ink">
                  <span className="block font-display text-xl font-extrabold">{s.title}</span>
                  <span className="mt-1 block text-sm text-graphite-soft">
                    Your role: <strong>{ROLE_LABELS[s.role]}</strong>
                  </span>
                </Link>
              </li>
            ))}
          </ul>
        )}
      </section>
      <section aria-labelledby="new-series" className="panel h-fit p-5">
        <h2 id="new-series" className="text-xl font-extrabold">
          Start a series
        </h2>
        <p className="mt-1 text-sm text-graphite-soft">You will be its owner.</p>
        <form onSubmit={onSubmit} noValidate className="mt-4 space-y-3">
          {error && (
            <p role="alert" className="text-sm text-stamp">
              {error}
            </p>
          )}
          <Field id="series-title" label="Series title" error={formState.errors.title?.message}>
            <input id="series-title" className="field" {...register('title')} />
          </Field>
          <Button type="submit" disabled={formState.isSubmitting}>
            Create series
          </Button>
        </form>
      </section>
    </div>
  );
}
