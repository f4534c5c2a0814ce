import Link from 'next/link';
import type { SessionUser } from '@/lib/auth/session';
import { Wordmark } from './wordmark';

export function StudioHeader({ user }: { user: SessionUser | null }) {
  return (
    <header className="border-b border-paper-edge bg-paper/90 backdrop-blur">
      <div className="mx-auto flex max-w-7xl flex-wrap items-center justify-between gap-3 px-4 py-3">
        <div className="flex items-center gap-6">
          <Wordmark href="/series" />
          <nav aria-label="Main">
            <Link href="/series" className="rounded px-2 py-1 text-sm font-bold text-graphite-soft hover:text-graphite">
              My series
            </Link>
          </nav>
        </div>
        {user && (
          <div className="flex items-center gap-3 text-sm">
            <span className="text-graphite-soft">
              Signed in as <strong className="text-graphite">{user.name}</strong>
            </span>
            <Link href="/account" className="rounded px-2 py-1 font-bold text-ink hover:underline">
              My account
            </Link>
            <Link href="/signout" className="rounded px-2 py-1 font-bold text-ink hover:underline">
              Sign out
            </Link>
          </div>
        )}
      </div>
    </header>
  );
}
