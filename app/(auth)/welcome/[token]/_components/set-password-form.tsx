'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import Link from 'next/link';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { apiJson, applyFieldErrors } from '@/lib/client/api';
import { acceptInvitationSchema, type AcceptInvitationInput } from '@/lib/shared/schemas/office';

const field = 'mt-1 block min-h-12 w-full rounded-md border-2 border-stone bg-white px-3 text-lg';

/** Sets the password of an invited account; the link is spent on success. */
export function SetPasswordForm({ token, email }: { token: string; email: string }) {
  const [done, setDone] = useState(false);
  const [serverError, setServerError] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<AcceptInvitationInput>({ resolver: zodResolver(acceptInvitationSchema) });
  const { errors, isSubmitting } = formState;
  async function onSubmit(values: AcceptInvitationInput) {
    setServerError(null);
    try {
      await apiJson(`/api/invitations/${encodeURIComponent(token)}/accept`, { method: 'POST', body: values });
      setDone(true);
    } catch (error) {
      if (!applyFieldErrors(error, setError, ['password', 'confirm'])) setServerError(error instanceof Error ? error.message : 'Not saved.');
    }
  }
  if (done) {
    return (
      <div role="status" className="mt-6 space-y-3">
        <p className="text-lg font-bold text-moss">Your password is set.</p>
        <Link href="/login" className="inline-flex min-h-12 items-center rounded-md bg-slate px-5 text-lg font-bold text-white no-underline">
          Sign in
        </Link>
      </div>
    );
  }
  return (
    <form aria-label="Choose a password" noValidate onSubmit={handleSubmit(onSubmit)} className="mt-6 space-y-5">
      <input type="email" autoComplete="username" value={email} readOnly hidden />
      <div>
        <label htmlFor="password" className="block text-lg font-bold">
          New password
        </label>
        <input
          id="password"
          type="password"
          autoComplete="new-password"
          className={field}
          aria-invalid={!!errors.password}
          aria-describedby="password-help"
          {...register('password')}
        />
        <p id="password-help" className="mt-1 text-stone">
          At least 10 characters. A short sentence works well.
        </p>
        {errors.password && <p className="mt-1 font-bold text-clay">{errors.password.message}</p>}
      </div>
      <div>
        <label htmlFor="confirm" className="block text-lg font-bold">
          The same password again
        </label>
        <input id="confirm" type="password" autoComplete="new-password" className={field} aria-invalid={!!errors.confirm} {...register('confirm')} />
        {errors.confirm && <p className="mt-1 font-bold text-clay">{errors.confirm.message}</p>}
      </div>
      {serverError && (
        <p role="alert" className="rounded-md border-2 border-clay bg-white p-3 font-bold text-clay">
          {serverError}
        </p>
      )}
      <button type="submit" disabled={isSubmitting} className="min-h-14 w-full rounded-md bg-slate px-4 text-xl font-bold text-white disabled:opacity-70">
        {isSubmitting ? 'Saving…' : 'Set my password'}
      </button>
    </form>
  );
}
