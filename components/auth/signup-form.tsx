'use client';
import { signIn } from 'next-auth/react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { type Resolver, useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { api, messageOf } from '@/lib/http/client';
import type { SignUpInput } from '@/lib/validation/account';
import { PASSWORD_MIN } from '@/lib/validation/password-limits';
import { lazyZodResolver } from '@/lib/forms/lazy-resolver';

const checkOwn = lazyZodResolver<SignUpInput>(() => import('@/lib/validation/account').then((m) => m.signUpSchema));
const checkInvited = lazyZodResolver<SignUpInput>(() => import('@/lib/validation/account').then((m) => m.invitedSignUpSchema));
/** Without an e-mail field (never shown: the address comes from the invitation), the fields but the address are checked. */
const checkSignUp: Resolver<SignUpInput> = (values, context, options) =>
  (values.email === undefined ? checkInvited : checkOwn)(values, context, options);

/**
 * `invited`: the person came from an invitation tied to one address. The account then takes that address
 * from the invitation (shown partly masked, as the invitation page shows it), unless they choose another.
 */
export function SignUpForm({ callbackUrl, invited }: { callbackUrl?: string; invited?: { token: string; masked: string } | null }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [ownAddress, setOwnAddress] = useState(!invited);
  const fromInvitation = !!invited && !ownAddress;
  const { register, handleSubmit, formState } = useForm<SignUpInput>({ resolver: checkSignUp });

  const onSubmit = handleSubmit(async (values) => {
    setError(null);
    let email = values.email;
    try {
      const body = fromInvitation ? { name: values.name, password: values.password, invitation: invited!.token } : values;
      email = (await api<{ email: string }>('/api/users', { method: 'POST', json: body })).email;
    } catch (err) {
      setError(messageOf(err, 'Could not create the account.'));
      return;
    }
    const res = await signIn('credentials', { email, password: values.password, redirect: false });
    if (!res?.ok) {
      router.push('/signin');
      return;
    }
    router.push(callbackUrl && callbackUrl.startsWith('/') && !callbackUrl.startsWith('//') ? callbackUrl : '/series');
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="panel space-y-4 p-6" aria-labelledby="signup-title">
      <h1 id="signup-title" className="text-2xl font-extrabold">
        Create an account
      </h1>
      {error && (
        <p role="alert" className="rounded-md border border-stamp/40 bg-stamp-light px-3 py-2 text-sm text-stamp">
          {error}
        </p>
      )}
      <Field id="name" label="Your name" error={formState.errors.name?.message}>
        <input id="name" autoComplete="name" className="field" {...register('name')} />
      </Field>
      {fromInvitation ? (
        <div className="space-y-1">
          <p className="text-sm font-bold text-graphite-soft">E-mail</p>
          <p className="rounded-md border border-paper-edge bg-paper-deep/60 px-3 py-2" data-testid="invited-address">
            <strong>{invited!.masked}</strong>
            <span className="block text-xs text-graphite-faint">the address your invitation was sent to: your account takes it</span>
          </p>
          <button type="button" className="text-sm font-bold text-ink underline" onClick={() => setOwnAddress(true)}>
            Use another address
          </button>
        </div>
      ) : (
        <Field id="email" label="E-mail" error={formState.errors.email?.message}>
          <input id="email" type="email" autoComplete="email" className="field" {...register('email')} />
        </Field>
      )}
      <Field
        id="password"
        label="Password"
        hint={`At least ${PASSWORD_MIN} characters; a few unrelated words work well.`}
        error={formState.errors.password?.message}
      >
        <input id="password" type="password" autoComplete="new-password" className="field" {...register('password')} />
      </Field>
      <Button type="submit" disabled={formState.isSubmitting} className="w-full">
        {formState.isSubmitting ? 'Creating…' : 'Create account'}
      </Button>
      <p className="text-sm text-graphite-soft">
        Already have one?{' '}
        <Link href="/signin" className="font-bold text-ink underline">
          Sign in
        </Link>
      </p>
    </form>
  );
}
