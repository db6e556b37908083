'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Input, Select } from '@/components/ui/control';
import { Field } from '@/components/ui/field';
import { apiJson, applyFieldErrors } from '@/lib/client/api';
import { invitationSchema, type InvitationInput } from '@/lib/shared/schemas/office';

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
  return (
    <Card as="form" aria-label="Invite someone" noValidate onSubmit={handleSubmit(onSubmit)} className="space-y-4">
      <div className="grid gap-4 sm:grid-cols-3">
        <Field id="invite-name" label="Name" message={errors.name?.message}>
          {(control) => <Input {...control} {...register('name')} />}
        </Field>
        <Field id="invite-email" label="E-mail" message={errors.email?.message}>
          {(control) => <Input {...control} type="email" inputMode="email" {...register('email')} />}
        </Field>
        <Field id="invite-role" label="Role" message={errors.role?.message}>
          {(control) => (
            <Select {...control} {...register('role')}>
              <option value="advisor">Field advisor</option>
              <option value="farmer">Farmer</option>
              <option value="coordinator">Coordinator</option>
            </Select>
          )}
        </Field>
      </div>
      <Button size="lg" type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Sending…' : 'Send invitation'}
      </Button>
      {result && (
        <p role={result.ok ? 'status' : 'alert'} className={`font-bold ${result.ok ? 'text-moss' : 'text-clay'}`}>
          {result.text}
        </p>
      )}
    </Card>
  );
}
