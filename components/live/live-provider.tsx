'use client';
// Holds one live stream (EventSource) for the page: the editor's pass, a gag
// page, a series board. Components below subscribe to its events; while the
// stream is down they fall back to polling (useLiveSWR), and every (re)opening
// tells them to catch up, so a dropped stream loses nothing. A stream for a gag
// also carries who is here: this tab's place is sent with it, and the panel
// worked on is posted when it changes.
import { nanoid } from 'nanoid';
import { createContext, useCallback, useEffect, useMemo, useRef, useState } from 'react';
import type { PresenceDto } from '@/db/queries/presence';

export type LiveMessage = { topic: string; type: string; seq?: number; ids?: string[]; data?: unknown };

export type LiveContextValue = {
  /** True while the stream is open; polling is only the fallback. */
  connected: boolean;
  subscribe: (fn: (e: LiveMessage) => void) => () => void;
  tab: string;
  where: string | null;
  gagId: string | null;
  /** Tells the others which panel this tab is working on. */
  setPanel: (panel: number | null) => void;
};

export const LiveContext = createContext<LiveContextValue | null>(null);
/** Who has this gag open, as the stream last said (null before it has): its own context, so a heartbeat re-renders only who shows it. */
export const LivePresenceContext = createContext<PresenceDto[] | null>(null);

/** Back-off when the browser gave up on the stream (an error status, or no server). */
const REOPEN_MS = [1000, 2000, 5000, 10_000, 30_000];

export function LiveProvider({ url, gagId, where, children }: { url: string; gagId?: string; where?: string; children: React.ReactNode }) {
  const [tab] = useState(() => nanoid(12));
  const [connected, setConnected] = useState(false);
  const [presence, setPresence] = useState<PresenceDto[] | null>(null);
  const listeners = useRef(new Set<(e: LiveMessage) => void>());
  const panelRef = useRef<number | null>(null);

  const dispatch = useCallback((e: LiveMessage) => {
    for (const fn of listeners.current) fn(e);
  }, []);

  useEffect(() => {
    if (typeof EventSource === 'undefined') return;
    let es: EventSource | null = null;
    let failures = 0;
    let stopped = false;
    let timer: ReturnType<typeof setTimeout> | null = null;
    const open = () => {
      const q = new URLSearchParams();
      if (gagId) q.set('tab', tab);
      if (where) q.set('where', where);
      if (panelRef.current !== null) q.set('panel', String(panelRef.current));
      es = new EventSource(`${url}${q.size ? `?${q}` : ''}`);
      es.onopen = () => {
        failures = 0;
        setConnected(true);
        // Whatever happened while we were away: catch up now.
        dispatch({ topic: '*', type: 'open' });
      };
      es.onmessage = (m) => {
        let e: LiveMessage;
        try {
          e = JSON.parse(m.data as string) as LiveMessage;
        } catch {
          return;
        }
        if (e.type === 'presence' && Array.isArray(e.data)) setPresence(e.data as PresenceDto[]);
        if (e.type === 'gone') {
          // Access was withdrawn: stop, and let the fallback's requests say so.
          stopped = true;
          es?.close();
          setConnected(false);
        }
        dispatch(e);
      };
      es.onerror = () => {
        setConnected(false);
        // CONNECTING: the browser retries by itself. CLOSED: it gave up; try again later.
        if (es?.readyState === EventSource.CLOSED && !stopped) {
          timer = setTimeout(open, REOPEN_MS[Math.min(failures++, REOPEN_MS.length - 1)]);
        }
      };
    };
    open();
    return () => {
      stopped = true;
      if (timer) clearTimeout(timer);
      es?.close();
    };
  }, [url, gagId, where, tab, dispatch]);

  const setPanel = useCallback(
    (panel: number | null) => {
      if (!gagId || !where || panelRef.current === panel) return;
      panelRef.current = panel;
      void fetch(`/api/gags/${gagId}/presence`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ where, tab, panel }),
      }).catch(() => {});
    },
    [gagId, where, tab],
  );

  const subscribe = useCallback((fn: (e: LiveMessage) => void) => {
    listeners.current.add(fn);
    return () => {
      listeners.current.delete(fn);
    };
  }, []);

  const value = useMemo<LiveContextValue>(
    () => ({ connected, tab, where: where ?? null, gagId: gagId ?? null, setPanel, subscribe }),
    [connected, tab, where, gagId, setPanel, subscribe],
  );
  return (
    <LiveContext.Provider value={value}>
      <LivePresenceContext.Provider value={presence}>{children}</LivePresenceContext.Provider>
    </LiveContext.Provider>
  );
}
