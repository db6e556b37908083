'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { signInWithPassword } from '@/lib/client/sign-in';
import { sameOriginPath } from '@/lib/shared/return-path';
import { signInProblems } from '@/lib/shared/sign-in-rules';
import { Button } from '@/components/ui/button';

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
      <div>
        <label htmlFor="email" className="block text-lg font-bold">
          E-mail
        </label>
        <input
          id="email"
          type="email"
          autoComplete="username"
          inputMode="email"
          aria-invalid={!!errors.email}
          aria-describedby={errors.email ? 'email-error' : undefined}
          className="mt-1 block min-h-12 w-full rounded-md border-2 border-stone bg-white px-3 text-lg"
          name="email"
        />
        {errors.email && (
          <p id="email-error" className="mt-1 font-bold text-clay">
            {errors.email}
          </p>
        )}
      </div>
      <div>
        <label htmlFor="password" className="block text-lg font-bold">
          Password
        </label>
        <input
          id="password"
          type="password"
          autoComplete="current-password"
          aria-invalid={!!errors.password}
          aria-describedby={errors.password ? 'password-error' : undefined}
          className="mt-1 block min-h-12 w-full rounded-md border-2 border-stone bg-white px-3 text-lg"
          name="password"
        />
        {errors.password && (
          <p id="password-error" className="mt-1 font-bold text-clay">
            {errors.password}
          </p>
        )}
      </div>
      {serverError && (
        <p role="alert" className="rounded-md border-2 border-clay bg-white p-3 font-bold text-clay">
          {serverError}
        </p>
      )}
      <Button size="xl" className="w-full" type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
