'use client';
// The board's status columns and gag cards as they look, with or without dragging:
// components/board/board-dnd.tsx gives them their drag handles (loaded only for people
// who may move gags, after the board is shown, so the board's first load stays light).
import Link from 'next/link';
import { BeatGridMark } from '@/components/ui/beat-grid-mark';
import { GripGlyph } from '@/components/ui/board-glyphs';
import { StampMark } from '@/components/ui/stamp-mark';
import { StatusBadge } from '@/components/ui/status-badge';
import { When } from '@/components/ui/when';
import type { GagDto } from '@/db/queries/gags';
import { type GagStatus, STATUS_LABELS, type StatusCheck } from '@/lib/gags/status';

/** The columns' scrolling frame: `relative`, so screen-reader-only text inside is clipped here too and the page never widens. */
export function ColumnsFrame({ children }: { children: React.ReactNode }) {
  return (
    <div
      className="relative flex snap-x gap-3 overflow-x-auto pb-3"
      role="region"
      aria-label="Gags by status"
      tabIndex={0}
      data-testid="board-columns"
    >
      {children}
    </div>
  );
}

export function Column({
  status,
  count,
  check = null,
  over = false,
  attach,
  children,
}: {
  status: GagStatus;
  count: number;
  /** While a card is dragged: whether it may come here (null for its own column, or no drag). */
  check?: StatusCheck | null;
  over?: boolean;
  attach?: (el: HTMLElement | null) => void;
  children: React.ReactNode;
}) {
  const tone = !check ? 'border-paper-edge' : check.ok ? 'border-ink border-dashed' : 'border-paper-edge opacity-70';
  return (
    <section
      ref={attach}
      aria-label={STATUS_LABELS[status]}
      data-testid={`column-${status}`}
      className={`w-64 shrink-0 snap-start rounded-lg border bg-paper-deep/50 p-2 ${tone} ${over && check?.ok ? 'bg-ink-light/60' : ''}`}
    >
      <h2 className="flex items-center justify-between px-1 pb-2 font-sans text-sm font-bold">
        <span>{STATUS_LABELS[status]}</span>
        <span className="rounded-full bg-white px-2 text-xs text-graphite-faint">
          {count}
          <span className="sr-only"> gags</span>
        </span>
      </h2>
      {over && check && !check.ok && (
        <p className="mb-2 rounded-md border border-paper-edge bg-white px-2 py-1 text-xs text-graphite-soft" aria-hidden>
          {check.reason}
        </p>
      )}
      <ul className="min-h-12 space-y-2">{children}</ul>
    </section>
  );
}

/** What makes a card movable: pointer listeners on the card, the keyboard's on its grip. */
export type CardDrag = { pointer: Record<string, unknown>; grip: Record<string, unknown>; dragging: boolean };

export function GagCard({
  seriesId,
  gag,
  drag,
  attach,
  attachGrip,
}: {
  seriesId: string;
  gag: GagDto;
  drag?: CardDrag;
  /** The card's and its grip's DOM nodes, for dnd-kit. */
  attach?: (el: HTMLElement | null) => void;
  attachGrip?: (el: HTMLElement | null) => void;
}) {
  return (
    <article
      ref={attach}
      {...drag?.pointer}
      className={`panel relative p-3 transition-colors focus-within:border-ink hover:border-ink ${drag?.dragging ? 'opacity-40' : ''} ${drag ? 'cursor-grab' : ''}`}
    >
      {drag && (
        <button
          ref={attachGrip}
          type="button"
          {...drag.grip}
          aria-label={`Move “${gag.title}” to another status`}
          className="absolute right-1.5 top-1.5 z-10 rounded bg-white/80 p-1 text-graphite-faint hover:bg-paper-deep hover:text-graphite"
        >
          <GripGlyph className="h-4 w-4" />
        </button>
      )}
      {gag.latestPass && (
        // eslint-disable-next-line @next/next/no-img-element -- a private, per-pass SVG served by our own route
        <img
          src={`/api/passes/${gag.latestPass.id}/thumbnail.svg?v=${gag.latestPass.seq}`}
          alt={`Pass ${gag.latestPass.number} of “${gag.title}”`}
          width={120}
          height={120}
          loading="lazy"
          draggable={false}
          className="mb-2 aspect-square w-full rounded border border-paper-edge bg-white"
        />
      )}
      <h3 className="font-sans text-base font-bold leading-snug">
        <Link href={`/series/${seriesId}/gags/${gag.id}`} draggable={false} className="after:absolute after:inset-0 focus:outline-none">
          {gag.title}
        </Link>
      </h3>
      {gag.premise && <p className="mt-1 line-clamp-3 text-sm text-graphite-soft">{gag.premise}</p>}
      {gag.stamp && <StampMark decision={gag.stamp.decision} standing={gag.stamp.standing} passNumber={gag.stamp.passNumber} className="mt-2" />}
      <div className="mt-2 flex items-center justify-between gap-2 text-xs text-graphite-faint">
        <BeatGridMark beats={gag.beats} />
        <StatusBadge status={gag.status} />
      </div>
      <p className="mt-1 text-xs text-graphite-faint">
        Changed <When iso={gag.updatedAt} />
      </p>
    </article>
  );
}

/** The card under the pointer or in hand while it moves (shown above everything). */
export function CardInHand({ gag }: { gag: GagDto }) {
  return (
    <div className="panel w-full cursor-grabbing border-ink p-3 shadow-lg" aria-hidden>
      <p className="font-sans text-base font-bold leading-snug">{gag.title}</p>
      <div className="mt-2 flex justify-end">
        <StatusBadge status={gag.status} />
      </div>
    </div>
  );
}
