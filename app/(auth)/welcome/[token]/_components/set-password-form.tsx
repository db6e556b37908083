'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button, ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Input } from '@/components/ui/control';
import { Field } from '@/components/ui/field';
import { apiJson, applyFieldErrors } from '@/lib/client/api';
import { acceptInvitationSchema, type AcceptInvitationInput } from '@/lib/shared/schemas/office';

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
        <ButtonLink href="/login" size="lg">
          Sign in
        </ButtonLink>
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
        <Input
          className="px-3"
          id="password"
          type="password"
          autoComplete="new-password"
          aria-invalid={!!errors.password}
          aria-describedby="password-help"
          {...register('password')}
        />
        <p id="password-help" className="mt-1 text-stone">
          At least 10 characters. A short sentence works well.
        </p>
        {errors.password && <p className="mt-1 font-bold text-clay">{errors.password.message}</p>}
      </div>
      <Field id="confirm" label="The same password again" labelClassName="text-lg" message={errors.confirm?.message}>
        {(control) => <Input {...control} className="px-3" type="password" autoComplete="new-password" {...register('confirm')} />}
      </Field>
      {serverError && (
        <Card as="p" tone="alarm" padding="md" className="font-bold text-clay" role="alert">
          {serverError}
        </Card>
      )}
      <Button size="xl" className="w-full" type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Saving…' : 'Set my password'}
      </Button>
    </form>
  );
}
