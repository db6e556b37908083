'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Input } from '@/components/ui/control';
import { Field } from '@/components/ui/field';
import { signInWithPassword } from '@/lib/client/sign-in';
import { sameOriginPath } from '@/lib/shared/return-path';
import { signInProblems } from '@/lib/shared/sign-in-rules';

/**
 * The sign-in form: the first page a phone loads, so it carries no form or schema library (the
 * fields are checked by sign-in-rules, with the server's limits; the server checks again).
 */
export function SignInForm({ returnTo }: { returnTo?: string }) {
  const router = useRouter();
  const [serverError, setServerError] = useState<string | null>(null);
  const [errors, setErrors] = useState<{ email?: string; password?: string }>({});
  const [isSubmitting, setSubmitting] = useState(false);

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const email = String(data.get('email') ?? '');
    const password = String(data.get('password') ?? '');
    const problems = signInProblems(email, password);
    setErrors(problems);
    setServerError(null);
    if (problems.email || problems.password) return;
    setSubmitting(true);
    try {
      const error = await signInWithPassword(email.trim().toLowerCase(), password, returnTo ?? '/');
      if (error) {
        setServerError(error !== 'CredentialsSignin' ? error : 'That e-mail and password do not match an active account.');
        return;
      }
      // Checked again here: the page's check ran against the configured origin, this one against the browser's.
      router.replace(sameOriginPath(returnTo, window.location.origin) ?? '/');
      router.refresh();
    } catch {
      setServerError('Fallbook did not answer; check the connection and try again.');
    } finally {
      setSubmitting(false);
    }
  }

  return (
    <form onSubmit={onSubmit} noValidate className="mt-8 space-y-5" aria-label="Sign in">
      <Field id="email" label="E-mail" labelClassName="text-lg" message={errors.email}>
        {(control) => <Input {...control} className="px-3" type="email" autoComplete="username" inputMode="email" name="email" />}
      </Field>
      <Field id="password" label="Password" labelClassName="text-lg" message={errors.password}>
        {(control) => <Input {...control} className="px-3" type="password" autoComplete="current-password" name="password" />}
      </Field>
      {serverError && (
        <Card as="p" tone="alarm" padding="md" className="font-bold text-clay" role="alert">
          {serverError}
        </Card>
      )}
      <Button size="xl" className="w-full" type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
