import { Check, CloudOff, Loader2, PencilLine } from 'lucide-react';
import type { SaveState } from '@/hooks/use-autosave';
import { SAVED_WORDS } from './save-words';

const TEXT: Record<SaveState, string> = {
  saved: SAVED_WORDS,
  pending: 'Unsaved changes…',
  saving: 'Saving…',
  error: 'Not saved',
};

export function SaveIndicator({ state, message }: { state: SaveState; message?: string | null }) {
  const Icon = state === 'saved' ? Check : state === 'saving' ? Loader2 : state === 'error' ? CloudOff : PencilLine;
  return (
    <p
      role="status"
      aria-live="polite"
      data-save-state={state}
      className={`inline-flex items-center gap-1.5 text-sm ${state === 'error' ? 'text-stamp' : 'text-graphite-faint'}`}
    >
      <Icon aria-hidden className={`h-4 w-4 ${state === 'saving' ? 'animate-spin' : ''}`} />
      {TEXT[state]}
      {state === 'error' && message ? `: ${message}` : ''}
    </p>
  );
}
