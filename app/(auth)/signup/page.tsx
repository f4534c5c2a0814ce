import type { Metadata } from 'next';
import { SignUpForm } from '@/components/auth/signup-form';
import { getDb } from '@/db/client';
import { invitedAddress } from '@/db/queries/invitation-changes';

export const metadata: Metadata = { title: 'Create an account' };

/** Coming from an invitation link (`callbackUrl=/invite/<token>`) tied to one address, the form takes that address. */
export default async function SignUpPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const { callbackUrl } = await searchParams;
  const token = /^\/invite\/([A-Za-z0-9_-]{1,200})$/.exec(callbackUrl ?? '')?.[1];
  const invited = token ? await invitedAddress(await getDb(), token) : null;
  return <SignUpForm callbackUrl={callbackUrl} invited={invited && token ? { token, masked: invited.masked } : null} />;
}
