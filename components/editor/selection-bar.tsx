'use client';
// The strip over the canvas's lower corner: the save status, and what can be done
// with the chosen strokes or balloon room.
import { BEAT_KINDS, BEAT_LABELS } from '@/lib/gags/status';
import type { SyncStatus } from './pass-sync';
import { SyncBadge } from './sync-badge';

const action = 'rounded px-2 py-0.5 hover:bg-paper-deep';

export function SelectionBar(p: {
  status: SyncStatus;
  canDraw: boolean;
  selected: number;
  roomChosen: boolean;
  onDeleteStrokes: () => void;
  onCopyTo: (panel: number) => void;
  onDone: () => void;
  onDeleteRoom: () => void;
}) {
  return (
    <div className="absolute bottom-2 left-2 z-10 flex flex-wrap items-center gap-2">
      <SyncBadge status={p.status} readOnly={!p.canDraw} />
      {p.selected > 0 && p.canDraw && (
        <div className="panel flex flex-wrap items-center gap-1 px-2 py-1 text-sm" role="group" aria-label="Selection">
          <span className="font-bold">{p.selected} selected</span>
          <button type="button" className={action} onClick={p.onDeleteStrokes}>
            Delete
          </button>
          <span className="text-graphite-faint">Copy to:</span>
          {BEAT_KINDS.map((k, i) => (
            <button key={k} type="button" className={action} onClick={() => p.onCopyTo(i)}>
              {i + 1} {BEAT_LABELS[k]}
            </button>
          ))}
          <button type="button" className={action} onClick={p.onDone}>
            Done
          </button>
        </div>
      )}
      {p.roomChosen && p.canDraw && (
        <div className="panel flex items-center gap-1 px-2 py-1 text-sm" role="group" aria-label="Balloon room">
          <span className="font-bold">Balloon room</span>
          <button type="button" className={action} onClick={p.onDeleteRoom}>
            Delete room
          </button>
        </div>
      )}
    </div>
  );
}
