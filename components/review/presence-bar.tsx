'use client';
import { Users } from 'lucide-react';
import { usePresence } from '@/hooks/use-review';

function whereLabel(scope: string) {
  const where = scope.split(':').slice(1).join(':');
  if (where.startsWith('pass:')) return `in pass ${where.slice(5)}`;
  if (where === 'compare') return 'comparing passes';
  return 'on this page';
}

/** Who else has this gag open right now. */
export function PresenceBar({ gagId, where, meId }: { gagId: string; where: string; meId: string }) {
  const { data } = usePresence(gagId, where);
  const others = (data ?? []).filter((p) => p.userId !== meId);
  const byPerson = new Map<string, string[]>();
  for (const p of others) byPerson.set(p.name, [...(byPerson.get(p.name) ?? []), whereLabel(p.scope)]);
  return (
    <p className="inline-flex items-center gap-1.5 text-sm text-graphite-soft" aria-live="polite" data-testid="presence">
      <Users aria-hidden className="h-4 w-4" />
      {byPerson.size === 0
        ? 'Only you here'
        : [...byPerson].map(([name, wheres]) => `${name} (${[...new Set(wheres)].join(', ')})`).join(' · ')}
    </p>
  );
}
