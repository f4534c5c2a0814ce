'use client';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { messageOf } from '@/lib/http/client';
import { acceptInvitation } from '@/hooks/use-members';

export function AcceptInvitation({
  token,
  signedIn,
  seriesTitle,
  role,
  invitedBy,
  sentTo,
  problem,
  wrongAccount = false,
}: {
  token: string;
  signedIn: boolean;
  seriesTitle: string;
  role: string;
  invitedBy: string;
  /** The address it was sent to, partly masked; null for a link anyone may use. */
  sentTo: string | null;
  problem: string | null;
  /** Signed in with another address than the invitation's. */
  wrongAccount?: boolean;
}) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(problem);
  const back = encodeURIComponent(`/invite/${token}`);
  return (
    <div className="panel space-y-4 p-6">
      <h1 className="text-2xl font-extrabold">Join “{seriesTitle}”</h1>
      <p className="text-graphite-soft">
        {invitedBy} invites you as <strong>{role}</strong>.{' '}
        {sentTo ? (
          <>
            The invitation is for the account with the address <strong>{sentTo}</strong>
            {signedIn ? '.' : ': sign in with it, or create an account with it.'}
          </>
        ) : (
          'Anyone with this link may accept it, once.'
        )}
      </p>
      {error && (
        <p role="alert" className="rounded-md border border-stamp/40 bg-stamp-light px-3 py-2 text-sm text-stamp">
          {error}
        </p>
      )}
      {wrongAccount && (
        <p>
          <Link href="/signout" className="font-bold text-ink underline">
            Sign out
          </Link>{' '}
          to accept with another account.
        </p>
      )}
      {!problem &&
        (signedIn ? (
          <Button
            onClick={async () => {
              setError(null);
              try {
                const r = await acceptInvitation(token);
                router.push(`/series/${r.seriesId}`);
              } catch (err) {
                setError(messageOf(err, 'Could not accept.'));
              }
            }}
          >
            Accept the invitation
          </Button>
        ) : (
          <p className="flex flex-wrap gap-3">
            <Link href={`/signin?callbackUrl=${back}`} className="rounded-md bg-ink px-3 py-2 text-sm font-bold text-white">
              Sign in to accept
            </Link>
            <Link href={`/signup?callbackUrl=${back}`} className="rounded-md border border-paper-edge bg-white px-3 py-2 text-sm font-bold">
              Create an account
            </Link>
          </p>
        ))}
    </div>
  );
}
