'use client';
// The series' default page: trim, bleed, safe margin, gutter (mm). Owners edit it;
// everyone else sees it. Volumes will bring their own specs later.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { Button } from '@/components/ui/button';
import { type PageSpec, panelRects } from '@/lib/print/geometry';
import { messageOf } from '@/lib/http/client';
import { pageSpecSchema } from '@/lib/validation/pass';
import { savePrintSpec } from '@/hooks/use-print-spec';

const FIELDS: { key: keyof PageSpec; label: string }[] = [
  { key: 'trimW', label: 'Trim width' },
  { key: 'trimH', label: 'Trim height' },
  { key: 'bleed', label: 'Bleed' },
  { key: 'safe', label: 'Safe margin' },
  { key: 'gutter', label: 'Gutter' },
];

export function PageSpecForm({ seriesId, initial, canEdit }: { seriesId: string; initial: PageSpec; canEdit: boolean }) {
  const [saved, setSaved] = useState<PageSpec>(initial);
  const [message, setMessage] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<z.input<typeof pageSpecSchema>, unknown, PageSpec>({
    resolver: zodResolver(pageSpecSchema),
    defaultValues: initial,
  });
  const panel = panelRects(saved)[0]!;
  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      const spec = await savePrintSpec(seriesId, values);
      setSaved(spec);
      setMessage('Page setup saved.');
    } catch (err) {
      setMessage(messageOf(err, 'Could not save the page setup.'));
    }
  });
  const formError = formState.errors.root?.message ?? Object.values(formState.errors)[0]?.message;
  return (
    <details className="panel p-4">
      <summary className="cursor-pointer font-bold">
        Page setup: {saved.trimW} × {saved.trimH} mm, bleed {saved.bleed} mm, panels {panel.w.toFixed(1)} × {panel.h.toFixed(1)} mm
      </summary>
      <form onSubmit={onSubmit} noValidate className="mt-3 flex flex-wrap items-end gap-3" aria-label="Page setup">
        {FIELDS.map((f) => (
          <label key={f.key} className="text-sm font-bold text-graphite-soft">
            {f.label} (mm)
            <input type="number" step="0.5" className="field mt-1 w-28" disabled={!canEdit} {...register(f.key, { valueAsNumber: true })} />
          </label>
        ))}
        {canEdit && (
          <Button type="submit" disabled={formState.isSubmitting}>
            Save page setup
          </Button>
        )}
        <p className="w-full text-sm text-graphite-soft" aria-live="polite">
          {formError ? <span className="text-stamp">{String(formError)}</span> : message}
          {!canEdit && ' Only the owner changes the page setup.'} The printer&apos;s own specification takes precedence.
        </p>
      </form>
    </details>
  );
}
