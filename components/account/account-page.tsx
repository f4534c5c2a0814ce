'use client';
// My account: who I am, and a new password (the current one first). Changing it signs out every other device.
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { changePassword } from '@/hooks/use-members';
import { ApiError, messageOf } from '@/lib/http/client';
import type { PasswordChangeInput } from '@/lib/validation/account';
import { PASSWORD_MIN } from '@/lib/validation/password-limits';
import { lazyZodResolver } from '@/lib/forms/lazy-resolver';

export function AccountPage({ name, email }: { name: string; email: string }) {
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const form = useForm<PasswordChangeInput>({
    resolver: lazyZodResolver(() => import('@/lib/validation/account').then((m) => m.passwordChangeSchema)),
    defaultValues: { currentPassword: '', newPassword: '' },
  });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    setMessage(null);
    try {
      const r = await changePassword(values);
      form.reset({ currentPassword: '', newPassword: '' });
      const others = r.otherSessionsEnded ?? 0;
      setMessage({
        ok: true,
        text: `Password changed. ${others === 0 ? 'No other device was signed in.' : `${others} other ${others === 1 ? 'session was' : 'sessions were'} signed out.`}`,
      });
    } catch (err) {
      // The server's reasons by their field (wrong current password, a common password), or as one message.
      const issues = err instanceof ApiError && Array.isArray(err.issues) ? (err.issues as { path?: unknown[]; message: string }[]) : [];
      let placed = false;
      for (const issue of issues) {
        const field = issue.path?.[0];
        if (field === 'currentPassword' || field === 'newPassword') {
          form.setError(field, { message: issue.message });
          placed = true;
        }
      }
      if (!placed) setMessage({ ok: false, text: messageOf(err, 'The password could not be changed.') });
    }
  });

  return (
    <div className="max-w-xl space-y-6">
      <div>
        <h1 className="text-3xl font-extrabold">My account</h1>
        <p className="text-graphite-soft">
          {name} · {email}
        </p>
      </div>
      {message && (
        <p
          role={message.ok ? 'status' : 'alert'}
          className={`rounded-md px-3 py-2 text-sm ${message.ok ? 'bg-ink-light text-ink' : 'bg-stamp-light text-stamp'}`}
        >
          {message.text}
        </p>
      )}
      <form onSubmit={onSubmit} noValidate className="panel space-y-4 p-4" aria-labelledby="password-title">
        <h2 id="password-title" className="text-xl font-extrabold">
          Change the password
        </h2>
        <Field id="current-password" label="Current password" error={errors.currentPassword?.message}>
          <input id="current-password" type="password" autoComplete="current-password" className="field" {...form.register('currentPassword')} />
        </Field>
        <Field
          id="new-password"
          label="New password"
          hint={`At least ${PASSWORD_MIN} characters; a few unrelated words work well.`}
          error={errors.newPassword?.message}
        >
          <input id="new-password" type="password" autoComplete="new-password" className="field" {...form.register('newPassword')} />
        </Field>
        <p className="text-xs text-graphite-faint">Every other device signed in to your account is signed out; this one stays signed in.</p>
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Changing…' : 'Change the password'}
        </Button>
      </form>
    </div>
  );
}
