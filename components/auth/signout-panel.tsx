'use client';
import { signOut } from 'next-auth/react';
import Link from 'next/link';
import { useState } from 'react';
import { Button } from '@/components/ui/button';

export function SignOutPanel() {
  const [busy, setBusy] = useState(false);
  return (
    <div className="panel space-y-4 p-6">
      <h1 className="text-2xl font-extrabold">Sign out</h1>
      <p className="text-graphite-soft">Your thumbnails stay on the board. Sign out of Quadrille on this device?</p>
      <div className="flex gap-2">
        <Button
          disabled={busy}
          onClick={() => {
            setBusy(true);
            void signOut({ callbackUrl: '/' });
          }}
        >
          Sign out
        </Button>
        <Link href="/series" className="inline-flex items-center rounded-md px-3 py-2 text-sm font-bold text-graphite-soft hover:bg-paper-deep">
          Stay signed in
        </Link>
      </div>
    </div>
  );
}
