import type { Metadata } from 'next';
import { SignInForm } from '@/components/auth/signin-form';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const { callbackUrl, error } = await searchParams;
  return <SignInForm callbackUrl={callbackUrl} initialError={error} />;
}
