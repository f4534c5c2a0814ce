// What each kind of change tells the open streams, in one place. Routes call
// these after their change has committed (the "notify" step of a mutation).
import 'server-only';
import { publish } from './bus';

/** What changed on a gag's page; clients refetch the matching data. */
export type GagPart = 'gag' | 'passes' | 'comments' | 'stamps' | 'checklist' | 'final';
/** What changed on a series board; 'final': a final page of one of its pages (a gag's or a matter page's) was uploaded, fitted or made current. */
export type SeriesPart = 'gags' | 'activity' | 'members' | 'final';

export function gagChanged(seriesId: string, gagId: string, parts: GagPart[], seriesParts: SeriesPart[] = []) {
  return publish(
    ...parts.map((type) => ({ topic: `gag:${gagId}`, type, ids: [gagId] })),
    ...seriesParts.map((type) => ({ topic: `series:${seriesId}`, type, ids: [gagId] })),
  );
}

export function seriesChanged(seriesId: string, parts: SeriesPart[], ids?: string[]) {
  return publish(...parts.map((type) => ({ topic: `series:${seriesId}`, type, ...(ids ? { ids } : {}) })));
}

/**
 * A final page changed (uploaded, fitted, made current): a gag's page refreshes its final
 * page and status, and the series' streams (a volume's flatplan and preflight) hear 'final'.
 * A matter page has no gag page, no board card and no activity: the series hears 'final' alone.
 */
export function finalChanged(seriesId: string, owner: { gagId: string | null; entryId: string | null }, seriesParts: SeriesPart[] = []) {
  if (owner.gagId) return gagChanged(seriesId, owner.gagId, ['final', 'gag'], [...seriesParts, 'final']);
  return seriesChanged(seriesId, ['final'], owner.entryId ? [owner.entryId] : undefined);
}

/**
 * A pass took a new seq: its editors read ?since=seq; its gag's page refreshes the
 * pass cards, and when a stamp was cleared, the stamps, the status and the board.
 */
export function passChanged(p: { seriesId: string; gagId: string; passId: string; seq: number; stampCleared: boolean }) {
  return publish(
    { topic: `pass:${p.passId}`, type: 'seq', seq: p.seq },
    { topic: `gag:${p.gagId}`, type: 'passes', ids: [p.passId], seq: p.seq },
    ...(p.stampCleared
      ? [
          { topic: `gag:${p.gagId}`, type: 'stamps', ids: [p.passId] },
          { topic: `gag:${p.gagId}`, type: 'gag', ids: [p.gagId] },
          { topic: `series:${p.seriesId}`, type: 'gags', ids: [p.gagId] },
          { topic: `series:${p.seriesId}`, type: 'activity' },
        ]
      : []),
  );
}

/** A person's access to a series changed: their open streams check again at once. */
export function accessChanged(seriesId: string, userId: string) {
  return publish({ topic: `user:${userId}`, type: 'access' }, { topic: `series:${seriesId}`, type: 'members', ids: [userId] });
}
