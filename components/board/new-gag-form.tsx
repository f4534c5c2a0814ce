'use client';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { messageOf } from '@/lib/http/client';
import type { CreateGagInput } from '@/lib/validation/gag';
import { lazyZodResolver } from '@/lib/forms/lazy-resolver';

export function NewGagForm({ onCreate }: { onCreate: (input: CreateGagInput) => Promise<unknown> }) {
  const [error, setError] = useState<string | null>(null);
  const [created, setCreated] = useState<string | null>(null);
  const { register, handleSubmit, formState, reset, setFocus } = useForm<CreateGagInput>({
    resolver: lazyZodResolver(() => import('@/lib/validation/gag').then((m) => m.createGagSchema)),
    defaultValues: { title: '', premise: '' },
  });
  const onSubmit = handleSubmit(async (values) => {
    setError(null);
    try {
      await onCreate(values);
      setCreated(values.title);
      reset();
      setFocus('title');
    } catch (err) {
      setError(messageOf(err, 'Could not create the gag.'));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="panel grid gap-3 p-4 md:grid-cols-[1fr_2fr_auto] md:items-end" aria-label="New gag">
      <Field id="new-gag-title" label="Title" error={formState.errors.title?.message}>
        <input id="new-gag-title" className="field" placeholder="A short working title" {...register('title')} />
      </Field>
      <Field id="new-gag-premise" label="Premise (one line)" error={formState.errors.premise?.message}>
        <input id="new-gag-premise" className="field" placeholder="What happens, in one line" {...register('premise')} />
      </Field>
      <Button type="submit" disabled={formState.isSubmitting}>
        Add gag
      </Button>
      <div className="md:col-span-3" aria-live="polite">
        {error && (
          <p role="alert" className="text-sm text-stamp">
            {error}
          </p>
        )}
        {created && !error && <p className="text-sm text-graphite-soft">Added “{created}” as an idea.</p>}
      </div>
    </form>
  );
}
