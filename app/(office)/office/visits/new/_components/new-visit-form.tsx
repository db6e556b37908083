'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { AdvisorAndDayFields } from '../../../_components/advisor-and-day-fields';
import { Button } from '@/components/ui/button';
import { Select, TextArea } from '@/components/ui/control';
import { Field } from '@/components/ui/field';
import { ApiError, apiJson, applyFieldErrors } from '@/lib/client/api';
import { visitCreateSchema, type VisitCreateInput } from '@/lib/shared/schemas/office';

type Opt = { id: string; name: string };

/** Plans a visit for a farm; with an advisor and a date it is booked at once and the advisor e-mailed. */
export function NewVisitForm({ farms, advisors, farmId }: { farms: Opt[]; advisors: Opt[]; farmId?: string }) {
  const router = useRouter();
  const [serverError, setServerError] = useState<string | null>(null);
  const [duplicate, setDuplicate] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError, getValues, control } = useForm<VisitCreateInput>({
    resolver: zodResolver(visitCreateSchema),
    defaultValues: { farmId: farmId ?? '', advisorId: '', plannedOn: '', confirmPast: false, notes: '' },
  });
  const { errors, isSubmitting } = formState;
  const plannedOn = useWatch({ control, name: 'plannedOn' }) as string | null | undefined;
  async function onSubmit(values: VisitCreateInput, confirmDuplicate = false) {
    setServerError(null);
    try {
      const { visit } = await apiJson<{ visit: { id: string } }>('/api/visits', { method: 'POST', body: { ...values, confirmDuplicate } });
      router.push(`/office/visits/${visit.id}`);
    } catch (error) {
      // The farm already has a visit under way: say so, and let the person plan another on purpose.
      if (error instanceof ApiError && error.code === 'duplicate') setDuplicate(error.message);
      else if (!applyFieldErrors(error, setError, ['farmId', 'advisorId', 'plannedOn', 'notes']))
        setServerError(error instanceof Error ? error.message : 'Not saved.');
    }
  }
  return (
    <form aria-label="Plan a visit" noValidate onSubmit={handleSubmit((v) => onSubmit(v))} className="max-w-xl space-y-4">
      <Field id="farmId" label="Farm" message={errors.farmId?.message}>
        {(control) => (
          <Select {...control} {...register('farmId')}>
            <option value="">Choose a farm…</option>
            {farms.map((f) => (
              <option key={f.id} value={f.id}>
                {f.name}
              </option>
            ))}
          </Select>
        )}
      </Field>
      <AdvisorAndDayFields
        advisors={advisors}
        advisor={{ field: register('advisorId'), label: 'Advisor (optional)', none: 'Not yet', message: errors.advisorId?.message }}
        day={{
          field: register('plannedOn'),
          label: 'Planned date (optional)',
          message: errors.plannedOn?.message,
          confirmPast: register('confirmPast'),
          value: plannedOn,
        }}
      />
      <Field id="notes" label="Notes for the advisor" message={errors.notes?.message}>
        {(control) => <TextArea {...control} rows={3} {...register('notes')} />}
      </Field>
      {serverError && (
        <p role="alert" className="font-bold text-clay">
          {serverError}
        </p>
      )}
      {duplicate && (
        <div role="alert" className="rounded-md border-2 border-ochre p-3">
          <p className="font-bold text-ochre">⚠ {duplicate}</p>
          <Button variant="caution" className="mt-2" onClick={() => onSubmit(visitCreateSchema.parse(getValues()), true)}>
            Plan another visit anyway
          </Button>
        </div>
      )}
      <Button size="lg" type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Saving…' : 'Plan the visit'}
      </Button>
    </form>
  );
}
