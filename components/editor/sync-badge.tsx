import { Check, CloudOff, Eye, Loader2, OctagonX } from 'lucide-react';
import { SAVED_WORDS } from '@/components/ui/save-words';
import type { SyncStatus } from './pass-sync';

export function SyncBadge({ status, readOnly }: { status: SyncStatus; readOnly: boolean }) {
  if (readOnly) {
    return (
      <p className="panel inline-flex items-center gap-1.5 px-2 py-1 text-sm text-graphite-soft" role="status">
        <Eye aria-hidden className="h-4 w-4" /> Read-only
      </p>
    );
  }
  const ops = (n: number) => `${n} operation${n === 1 ? '' : 's'} waiting`;
  const { state, waiting, message } = status;
  const text =
    state === 'saved'
      ? SAVED_WORDS
      : state === 'saving'
        ? `Saving… ${ops(waiting)}`
        : state === 'offline'
          ? `Offline — ${ops(waiting)}, kept on this device`
          : `Not saving: ${message ?? 'refused'}`;
  const Icon = state === 'saved' ? Check : state === 'saving' ? Loader2 : state === 'offline' ? CloudOff : OctagonX;
  return (
    <p
      role="status"
      aria-live="polite"
      data-sync-state={state}
      data-waiting={waiting}
      className={`panel inline-flex items-center gap-1.5 px-2 py-1 text-sm ${state === 'offline' || state === 'refused' ? 'text-stamp' : 'text-graphite-soft'}`}
    >
      <Icon aria-hidden className={`h-4 w-4 ${state === 'saving' ? 'animate-spin' : ''}`} />
      {text}
      {state !== 'refused' && message ? <span className="text-stamp"> · {message}</span> : null}
    </p>
  );
}
