'use client';
// The page setup's fields (loaded when the page setup is first opened): trim, bleed,
// safe margin and gutter in mm, checked as the server checks them.
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { Button } from '@/components/ui/button';
import { savePrintSpec } from '@/hooks/use-print-spec';
import { lazyZodResolver } from '@/lib/forms/lazy-resolver';
import { messageOf } from '@/lib/http/client';
import type { PageSpec } from '@/lib/print/geometry';
import type { pageSpecSchema } from '@/lib/validation/pass';

const FIELDS: { key: keyof PageSpec; label: string }[] = [
  { key: 'trimW', label: 'Trim width' },
  { key: 'trimH', label: 'Trim height' },
  { key: 'bleed', label: 'Bleed' },
  { key: 'safe', label: 'Safe margin' },
  { key: 'gutter', label: 'Gutter' },
];

export function PageSpecFields(props: { seriesId: string; initial: PageSpec; canEdit: boolean; onSaved: (spec: PageSpec) => void }) {
  const [message, setMessage] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<z.input<typeof pageSpecSchema>, unknown, PageSpec>({
    resolver: lazyZodResolver(() => import('@/lib/validation/pass').then((m) => m.pageSpecSchema)),
    defaultValues: props.initial,
  });
  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      props.onSaved(await savePrintSpec(props.seriesId, values));
      setMessage('Page setup saved.');
    } catch (err) {
      setMessage(messageOf(err, 'Could not save the page setup.'));
    }
  });
  const formError = formState.errors.root?.message ?? Object.values(formState.errors)[0]?.message;
  return (
    <form onSubmit={onSubmit} noValidate className="mt-3 flex flex-wrap items-end gap-3" aria-label="Page setup">
      {FIELDS.map((f) => (
        <label key={f.key} className="text-sm font-bold text-graphite-soft">
          {f.label} (mm)
          <input type="number" step="0.5" className="field mt-1 w-28" disabled={!props.canEdit} {...register(f.key, { valueAsNumber: true })} />
        </label>
      ))}
      {props.canEdit && (
        <Button type="submit" disabled={formState.isSubmitting}>
          Save page setup
        </Button>
      )}
      <p className="w-full text-sm text-graphite-soft" aria-live="polite">
        {formError ? <span className="text-stamp">{String(formError)}</span> : message}
        {!props.canEdit && ' Only the owner changes the page setup.'} The printer&apos;s own specification takes precedence.
      </p>
    </form>
  );
}
