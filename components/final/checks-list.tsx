'use client';
// Preflight checks as a list: each with its level in words and an icon (never colour
// alone), its message, and its rule's source on demand.
import { AlertTriangle, CheckCircle2, XCircle } from 'lucide-react';
import type { Check, Level } from '@/lib/print/preflight-rules';

export const LEVEL_WORDS: Record<Level, string> = { ok: 'OK', warn: 'Warning', fail: 'Must fix' };

export function LevelMark({ level, className = 'h-4 w-4' }: { level: Level; className?: string }) {
  const Icon = level === 'ok' ? CheckCircle2 : level === 'warn' ? AlertTriangle : XCircle;
  const tone = level === 'ok' ? 'text-ink' : level === 'warn' ? 'text-marker-80' : 'text-stamp';
  return <Icon aria-hidden className={`${className} shrink-0 ${tone}`} />;
}

export function ChecksList({ checks, label }: { checks: Check[]; label: string }) {
  return (
    <ul className="space-y-1 text-sm" aria-label={label}>
      {checks.map((c, i) => (
        <li key={`${c.rule}-${i}`} className="flex items-start gap-1.5" data-level={c.level} data-rule={c.rule}>
          <LevelMark level={c.level} className="mt-0.5 h-4 w-4" />
          <span>
            <strong className="mr-1">{LEVEL_WORDS[c.level]}:</strong>
            {c.message}{' '}
            <span className="text-xs text-graphite-soft" title={c.source}>
              ({c.source})
            </span>
          </span>
        </li>
      ))}
    </ul>
  );
}
