'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { apiJson, applyFieldErrors } from '@/lib/client/api';
import { invitationSchema, type InvitationInput } from '@/lib/shared/schemas/office';

const field = 'mt-1 block min-h-12 w-full rounded-md border-2 border-stone bg-white px-2 text-lg';

/** Invites a coordinator, advisor or farmer: they get a one-time link by e-mail to set a password. */
export function InviteForm() {
  const router = useRouter();
  const [result, setResult] = useState<{ ok: boolean; text: string } | null>(null);
  const { register, handleSubmit, formState, setError, reset } = useForm<InvitationInput>({
    resolver: zodResolver(invitationSchema),
    defaultValues: { role: 'advisor' },
  });
  const { errors, isSubmitting } = formState;
  async function onSubmit(values: InvitationInput) {
    setResult(null);
    try {
      const { invitation } = await apiJson<{ invitation: { email: string; mailSent: boolean } }>('/api/people/invitations', { method: 'POST', body: values });
      setResult(
        invitation.mailSent
          ? { ok: true, text: `Invitation sent to ${invitation.email}. The link works once, for 7 days.` }
          : { ok: false, text: `The invitation was made but the e-mail could not be sent; invite ${invitation.email} again.` },
      );
      reset({ name: '', email: '', role: values.role });
      router.refresh();
    } catch (error) {
      if (!applyFieldErrors(error, setError, ['name', 'email', 'role'])) setResult({ ok: false, text: error instanceof Error ? error.message : 'Not sent.' });
    }
  }
  const err = (name: 'name' | 'email' | 'role') =>
    errors[name] && (
      <p id={`${name}-error`} className="mt-1 font-bold text-clay">
        {errors[name]?.message}
      </p>
    );
  return (
    <form aria-label="Invite someone" noValidate onSubmit={handleSubmit(onSubmit)} className="space-y-4 rounded-md border border-rule bg-white p-4">
      <div className="grid gap-4 sm:grid-cols-3">
        <div>
          <label htmlFor="invite-name" className="block font-bold">
            Name
          </label>
          <input
            id="invite-name"
            className={field}
            aria-invalid={!!errors.name}
            aria-describedby={errors.name ? 'name-error' : undefined}
            {...register('name')}
          />
          {err('name')}
        </div>
        <div>
          <label htmlFor="invite-email" className="block font-bold">
            E-mail
          </label>
          <input
            id="invite-email"
            type="email"
            inputMode="email"
            className={field}
            aria-invalid={!!errors.email}
            aria-describedby={errors.email ? 'email-error' : undefined}
            {...register('email')}
          />
          {err('email')}
        </div>
        <div>
          <label htmlFor="invite-role" className="block font-bold">
            Role
          </label>
          <select id="invite-role" className={field} {...register('role')}>
            <option value="advisor">Field advisor</option>
            <option value="farmer">Farmer</option>
            <option value="coordinator">Coordinator</option>
          </select>
          {err('role')}
        </div>
      </div>
      <button type="submit" disabled={isSubmitting} className="min-h-12 rounded-md bg-slate px-5 text-lg font-bold text-white disabled:opacity-70">
        {isSubmitting ? 'Sending…' : 'Send invitation'}
      </button>
      {result && (
        <p role={result.ok ? 'status' : 'alert'} className={`font-bold ${result.ok ? 'text-moss' : 'text-clay'}`}>
          {result.text}
        </p>
      )}
    </form>
  );
}
