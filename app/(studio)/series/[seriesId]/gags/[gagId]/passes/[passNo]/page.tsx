import type { Metadata } from 'next';
import Link from 'next/link';
import { EditorLoader } from '@/components/editor/editor-loader';
import { PassEarlyRead } from '@/components/editor/pass-early-read';
import { can } from '@/lib/auth/permissions';
import { loadPassEditor } from '@/lib/data/studio';

export const metadata: Metadata = { title: 'Sketch' };
export const dynamic = 'force-dynamic';

export default async function PassEditorPage({ params }: { params: Promise<{ seriesId: string; gagId: string; passNo: string }> }) {
  const { seriesId, gagId, passNo } = await params;
  const { series, gag, role, pass, spec, passNumbers, passList, user } = await loadPassEditor(seriesId, gagId, Number(passNo));
  const canDraw = can(role, 'edit');
  return (
    <div className="space-y-2">
      <PassEarlyRead passId={pass.id} />
      <nav aria-label="Passes" className="flex flex-wrap items-center gap-2 text-sm">
        <Link href={`/series/${series.id}`} className="text-graphite-faint hover:underline">
          {series.title}
        </Link>
        <span className="text-graphite-faint">/</span>
        <Link href={`/series/${series.id}/gags/${gag.id}`} className="font-bold hover:underline">
          {gag.title}
        </Link>
        <span className="text-graphite-faint">/</span>
        <h1 className="font-display text-lg font-extrabold">Pass {pass.number}</h1>
        <span className="ml-2 inline-flex gap-1">
          {passNumbers.map((n) => (
            <Link
              key={n}
              href={`/series/${series.id}/gags/${gag.id}/passes/${n}`}
              aria-current={n === pass.number ? 'page' : undefined}
              className={`rounded px-2 py-0.5 ${n === pass.number ? 'bg-ink text-white' : 'bg-white/70 hover:bg-paper-deep'}`}
            >
              {n}
            </Link>
          ))}
        </span>
      </nav>
      <EditorLoader
        key={pass.id}
        passId={pass.id}
        passNumber={pass.number}
        gagId={gag.id}
        seriesId={series.id}
        meId={user.id}
        passes={passList}
        canDraw={canDraw}
        canComment={can(role, 'comment')}
        canRestore={canDraw}
        spec={spec}
        beats={gag.beats.map((b) => ({ kind: b.kind, note: b.note }))}
      />
    </div>
  );
}
