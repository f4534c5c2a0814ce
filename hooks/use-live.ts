'use client';
// The page's live stream (components/live/live-provider.tsx), for hooks and
// components. Without a provider, or while the stream is down, `connected` is
// false and data hooks poll as before.
import { useContext, useEffect, useEffectEvent } from 'react';
import useSWR, { type Key, type SWRConfiguration } from 'swr';
import { LiveContext, type LiveContextValue, type LiveMessage, LivePresenceContext } from '@/components/live/live-provider';

const OFFLINE: LiveContextValue = {
  connected: false,
  subscribe: () => () => {},
  tab: 'poll',
  where: null,
  gagId: null,
  setPanel: () => {},
};

const LIVE_SAFETY_POLL_MS = 60_000;

export function useLive(): LiveContextValue {
  return useContext(LiveContext) ?? OFFLINE;
}

/** Who is here, as the page's stream says (null without a stream, or before it has). */
export function useLivePresence() {
  return useContext(LivePresenceContext);
}

/** Calls `fn` for every event of the page's stream (the latest `fn`, without resubscribing). */
export function useLiveEvents(fn: (e: LiveMessage) => void) {
  const { subscribe } = useLive();
  const onEvent = useEffectEvent(fn);
  useEffect(() => subscribe((e) => onEvent(e)), [subscribe]);
}

/**
 * SWR data that the stream keeps fresh: refetched when an event of one of
 * `types` arrives (and whenever the stream (re)opens, to catch up); polled
 * every `pollMs` only while there is no stream.
 */
export function useLiveSWR<T>(
  key: Key,
  fetcher: ((url: string) => Promise<T>) | null,
  opts: SWRConfiguration<T> & { types: string[]; pollMs: number },
) {
  const { types, pollMs, ...swrOpts } = opts;
  const live = useLive();
  // While the stream is open, a slow safety net only: an event lost on the way is made good within a minute.
  const swr = useSWR<T>(key, fetcher, { ...swrOpts, refreshInterval: live.connected ? LIVE_SAFETY_POLL_MS : pollMs });
  const mutate = swr.mutate;
  useLiveEvents((e) => {
    if (key === null) return;
    if (e.type === 'open' || e.type === 'resync' || types.includes(e.type)) void mutate();
  });
  return swr;
}
