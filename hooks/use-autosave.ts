'use client';
// Collects edits, saves them after a short pause (or at once on flush), and
// reports a state a person can read: saved, unsaved, saving, or failed. A failed
// save keeps the edit and retries; a page leave with unsaved edits is warned.
import { useCallback, useEffect, useRef, useState } from 'react';
import { ApiError } from '@/lib/http/client';

export type SaveState = 'saved' | 'pending' | 'saving' | 'error';

export function useAutosave<P>(opts: { save: (patch: P) => Promise<void>; merge: (older: P, newer: P) => P; delay?: number; retryMs?: number }) {
  const { delay = 700, retryMs = 3000 } = opts;
  const [state, setState] = useState<SaveState>('saved');
  const [message, setMessage] = useState<string | null>(null);
  const pending = useRef<P | null>(null);
  const inflight = useRef<Promise<void> | null>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const optsRef = useRef(opts);
  useEffect(() => {
    optsRef.current = opts;
  });
  /** The latest flush, for timers set by an earlier one. */
  const flushRef = useRef<() => Promise<void>>(async () => {});
  const later = useCallback((ms: number) => {
    timer.current = setTimeout(() => void flushRef.current(), ms);
  }, []);

  const flush = useCallback(async (): Promise<void> => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    if (inflight.current) await inflight.current;
    const patch = pending.current;
    if (patch === null) return;
    pending.current = null;
    setState('saving');
    let failed = false;
    const run = (async () => {
      try {
        await optsRef.current.save(patch);
        setMessage(null);
        setState(pending.current === null ? 'saved' : 'pending');
      } catch (err) {
        failed = true;
        pending.current = pending.current === null ? patch : optsRef.current.merge(patch, pending.current);
        const clientError = err instanceof ApiError && err.status >= 400 && err.status < 500;
        setMessage(err instanceof Error ? err.message : 'Could not save.');
        setState('error');
        // A refused edit (4xx) will be refused again; wait for the person to change it.
        if (!clientError) later(retryMs);
      }
    })();
    inflight.current = run;
    await run;
    inflight.current = null;
    // Edits typed while this save was in flight go out after the usual pause.
    if (!failed && pending.current !== null && !timer.current) later(delay);
  }, [delay, retryMs, later]);
  useEffect(() => {
    flushRef.current = flush;
  }, [flush]);

  const queue = useCallback(
    (patch: P) => {
      pending.current = pending.current === null ? patch : optsRef.current.merge(pending.current, patch);
      setState((s) => (s === 'saving' ? s : 'pending'));
      if (timer.current) clearTimeout(timer.current);
      later(delay);
    },
    [delay, later],
  );

  useEffect(() => {
    const warn = (e: BeforeUnloadEvent) => {
      if (pending.current !== null || inflight.current) e.preventDefault();
    };
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, []);

  useEffect(
    () => () => {
      if (timer.current) clearTimeout(timer.current);
    },
    [],
  );

  return { state, message, queue, flush };
}
