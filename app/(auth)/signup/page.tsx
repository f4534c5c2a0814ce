import type { Metadata } from 'next';
import { SignUpForm } from '@/components/auth/signup-form';

export const metadata: Metadata = { title: 'Create an account' };

export default async function SignUpPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const { callbackUrl } = await searchParams;
  return <SignUpForm callbackUrl={callbackUrl} />;
}
