// A small memory of results by key — a pass id with its seq, and whatever else
// the result depends on — bounded in total size, with concurrent asks for the
// same key sharing one computation. Keys carry everything the value depends on,
// so a remembered value is never stale, whichever instance computed it.

import { LRUCache } from 'lru-cache';

export function remembered<T>(opts: { maxBytes: number; sizeOf: (value: T) => number }) {
  // Values are boxed: the cache holds objects, and a remembered null (nothing to show) is a value too.
  const kept = new LRUCache<string, { value: T }>({
    maxSize: opts.maxBytes,
    sizeCalculation: (box) => Math.max(1, opts.sizeOf(box.value)),
  });
  const running = new Map<string, Promise<T>>();
  return {
    async get(key: string, compute: () => Promise<T>): Promise<T> {
      const hit = kept.get(key);
      if (hit) return hit.value;
      const inFlight = running.get(key);
      if (inFlight) return inFlight;
      const p = compute().finally(() => running.delete(key));
      running.set(key, p);
      const value = await p;
      // One value larger than the whole budget is answered but not kept.
      if (opts.sizeOf(value) <= opts.maxBytes) kept.set(key, { value });
      return value;
    },
  };
}
