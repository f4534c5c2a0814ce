'use client';
import { signIn } from 'next-auth/react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import type { SignInInput } from '@/lib/validation/account';
import { lazyZodResolver } from '@/lib/forms/lazy-resolver';

const MESSAGES: Record<string, string> = {
  CredentialsSignin: 'That e-mail address and password do not match an account. Check both and try again.',
  TooManyAttempts: 'Too many failed sign-ins for this e-mail address. Wait 15 minutes, then try again.',
  TooManyFromClient: 'Too many failed sign-ins from your network. Wait 15 minutes, then try again.',
  SessionRequired: 'Sign in to see that page.',
};

/** Only same-site paths are followed after sign-in. */
function safeReturn(url: string | null | undefined): string {
  if (url && url.startsWith('/') && !url.startsWith('//')) return url;
  return '/series';
}

export function SignInForm({ callbackUrl, initialError }: { callbackUrl?: string; initialError?: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(initialError ? (MESSAGES[initialError] ?? 'Sign-in failed. Try again.') : null);
  const { register, handleSubmit, formState } = useForm<SignInInput>({
    resolver: lazyZodResolver(() => import('@/lib/validation/account').then((m) => m.signInSchema)),
  });

  const onSubmit = handleSubmit(async (values) => {
    setError(null);
    const res = await signIn('credentials', { ...values, redirect: false });
    if (!res || res.error || !res.ok) {
      const code = res?.error ?? (res?.status === 429 ? 'TooManyAttempts' : 'CredentialsSignin');
      setError(MESSAGES[code] ?? MESSAGES.CredentialsSignin!);
      return;
    }
    router.push(safeReturn(callbackUrl));
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="panel space-y-4 p-6" aria-labelledby="signin-title">
      <h1 id="signin-title" className="text-2xl font-extrabold">
        Sign in
      </h1>
      {error && (
        <p role="alert" className="rounded-md border border-stamp/40 bg-stamp-light px-3 py-2 text-sm text-stamp">
          {error}
        </p>
      )}
      <Field id="email" label="E-mail" error={formState.errors.email?.message}>
        <input id="email" type="email" autoComplete="email" className="field" {...register('email')} />
      </Field>
      <Field id="password" label="Password" error={formState.errors.password?.message}>
        <input id="password" type="password" autoComplete="current-password" className="field" {...register('password')} />
      </Field>
      <Button type="submit" disabled={formState.isSubmitting} className="w-full">
        {formState.isSubmitting ? 'Signing in…' : 'Sign in'}
      </Button>
      <p className="text-sm text-graphite-soft">
        New here?{' '}
        <Link href="/signup" className="font-bold text-ink underline">
          Create an account
        </Link>
      </p>
    </form>
  );
}
