'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { signInSchema, type SignInInput } from '@/lib/shared/schemas/sign-in';

export function SignInForm({ returnTo }: { returnTo?: string }) {
  const router = useRouter();
  const [serverError, setServerError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<SignInInput>({ resolver: zodResolver(signInSchema) });
  const { errors, isSubmitting } = formState;

  async function onSubmit(values: SignInInput) {
    setServerError(null);
    const result = await signIn('credentials', { ...values, redirect: false });
    if (!result || result.error) {
      setServerError(result?.error && result.error !== 'CredentialsSignin'
        ? result.error
        : 'That e-mail and password do not match an active account.');
      return;
    }
    router.replace(returnTo ?? '/');
    router.refresh();
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="mt-8 space-y-5" aria-label="Sign in">
      <div>
        <label htmlFor="email" className="block text-lg font-bold">E-mail</label>
        <input
          id="email" type="email" autoComplete="username" inputMode="email"
          aria-invalid={!!errors.email} aria-describedby={errors.email ? 'email-error' : undefined}
          className="mt-1 block min-h-12 w-full rounded-md border-2 border-stone bg-white px-3 text-lg"
          {...register('email')}
        />
        {errors.email && <p id="email-error" className="mt-1 font-bold text-clay">{errors.email.message}</p>}
      </div>
      <div>
        <label htmlFor="password" className="block text-lg font-bold">Password</label>
        <input
          id="password" type="password" autoComplete="current-password"
          aria-invalid={!!errors.password} aria-describedby={errors.password ? 'password-error' : undefined}
          className="mt-1 block min-h-12 w-full rounded-md border-2 border-stone bg-white px-3 text-lg"
          {...register('password')}
        />
        {errors.password && <p id="password-error" className="mt-1 font-bold text-clay">{errors.password.message}</p>}
      </div>
      {serverError && (
        <p role="alert" className="rounded-md border-2 border-clay bg-white p-3 font-bold text-clay">{serverError}</p>
      )}
      <button
        type="submit" disabled={isSubmitting}
        className="min-h-14 w-full rounded-md bg-slate px-4 text-xl font-bold text-white disabled:opacity-70"
      >
        {isSubmitting ? 'Signing in…' : 'Sign in'}
      </button>
    </form>
  );
}
