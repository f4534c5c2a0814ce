'use client';

/** A timestamp in the reader's own time zone (rendered on the client). */
export function When({ iso }: { iso: string }) {
  const d = new Date(iso);
  return (
    <time dateTime={iso} suppressHydrationWarning>
      {d.toLocaleString(undefined, { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' })}
    </time>
  );
}
