'use client';
import { Users } from 'lucide-react';
import { usePresence } from '@/hooks/use-review';
import { BEAT_KINDS, BEAT_LABELS } from '@/lib/gags/status';

function whereLabel(where: string, panel: number | null) {
  if (where.startsWith('pass:')) {
    const beat = panel !== null ? BEAT_KINDS[panel] : undefined;
    return `in pass ${where.slice(5)}${beat ? `, ${BEAT_LABELS[beat].toLowerCase()} panel` : ''}`;
  }
  if (where === 'compare') return 'comparing passes';
  return 'on this page';
}

/** Who else has this gag open right now, where, and on which panel. */
export function PresenceBar({ gagId, where, meId }: { gagId: string; where: string; meId: string }) {
  const { data } = usePresence(gagId, where);
  const others = (data ?? []).filter((p) => p.userId !== meId);
  const byPerson = new Map<string, string[]>();
  for (const p of others) byPerson.set(p.name, [...(byPerson.get(p.name) ?? []), whereLabel(p.where, p.panel)]);
  return (
    <p className="inline-flex items-center gap-1.5 text-sm text-graphite-soft" aria-live="polite" data-testid="presence">
      <Users aria-hidden className="h-4 w-4" />
      {byPerson.size === 0 ? 'Only you here' : [...byPerson].map(([name, wheres]) => `${name} (${[...new Set(wheres)].join(', ')})`).join(' · ')}
    </p>
  );
}
