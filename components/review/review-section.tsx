'use client';
// The review of a gag: pick a pass; its checklist, findings and stamp; the
// comment threads; who else is here; a way into the comparison.
import Link from 'next/link';
import { useState } from 'react';
import { type Role, can } from '@/lib/auth/permissions';
import { CommentsPanel } from './comments-panel';
import { PresenceBar } from './presence-bar';
import { ChecklistCard } from './checklist-card';
import { FindingsCard, StampCard } from './review-cards';
import { PassPicker } from './pass-picker';

export function ReviewSection({
  seriesId,
  gagId,
  role,
  meId,
  passes,
}: {
  seriesId: string;
  gagId: string;
  role: Role;
  meId: string;
  passes: { id: string; number: number; seq: number }[];
}) {
  const [passId, setPassId] = useState(passes[passes.length - 1]?.id ?? '');
  const pass = passes.find((p) => p.id === passId);
  const previous = pass ? passes.filter((p) => p.number < pass.number).sort((a, b) => b.number - a.number)[0] : undefined;
  return (
    <section aria-labelledby="review-title" className="space-y-3">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id="review-title" className="text-xl font-extrabold">
            Review
          </h2>
          <PresenceBar gagId={gagId} where="page" meId={meId} />
        </div>
        {passes.length > 0 && (
          <div className="flex flex-wrap items-end gap-3">
            <PassPicker label="Pass under review" passes={passes} value={passId} onChange={setPassId} />
            <Link
              href={`/series/${seriesId}/gags/${gagId}/compare`}
              className="rounded-md border border-paper-edge bg-white px-3 py-2 text-sm font-bold hover:bg-paper-deep"
            >
              Compare passes
            </Link>
          </div>
        )}
      </div>
      <div className="grid gap-4 lg:grid-cols-2">
        <div className="space-y-4">
          {pass ? (
            <>
              {/* What the pass shows and what people checked come first; the stamp is decided after reading them. */}
              <FindingsCard passId={pass.id} seq={pass.seq} />
              <ChecklistCard passId={pass.id} canTick={can(role, 'comment')} previous={previous} />
              <StampCard gagId={gagId} passId={pass.id} passNumber={pass.number} seq={pass.seq} canStamp={can(role, 'stamp')} />
            </>
          ) : (
            <p className="panel p-4 text-sm text-graphite-soft">The checklist, findings and stamp come with the first pass.</p>
          )}
        </div>
        <CommentsPanel gagId={gagId} seriesId={seriesId} meId={meId} canComment={can(role, 'comment')} passes={passes} />
      </div>
    </section>
  );
}
