// A small memory of results by key — a pass id with its seq, and whatever else
// the result depends on — bounded in total size, with concurrent asks for the
// same key sharing one computation. Keys carry everything the value depends on,
// so a remembered value is never stale, whichever instance computed it.

type Entry = { value: unknown; bytes: number };

export function remembered<T>(opts: { maxBytes: number; sizeOf: (value: T) => number }) {
  const kept = new Map<string, Entry>();
  const running = new Map<string, Promise<T>>();
  let total = 0;
  return {
    async get(key: string, compute: () => Promise<T>): Promise<T> {
      const hit = kept.get(key);
      if (hit) {
        kept.delete(key);
        kept.set(key, hit); // most recently used last
        return hit.value as T;
      }
      const inFlight = running.get(key);
      if (inFlight) return inFlight;
      const p = compute().finally(() => running.delete(key));
      running.set(key, p);
      const value = await p;
      const bytes = opts.sizeOf(value);
      if (bytes <= opts.maxBytes) {
        kept.set(key, { value, bytes });
        total += bytes;
        for (const [k, e] of kept) {
          if (total <= opts.maxBytes) break;
          kept.delete(k);
          total -= e.bytes;
        }
      }
      return value;
    },
  };
}
