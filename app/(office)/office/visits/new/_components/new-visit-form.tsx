'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { PastDayConfirm } from '@/components/past-day-confirm';
import { ApiError, apiJson, applyFieldErrors } from '@/lib/client/api';
import { visitCreateSchema, type VisitCreateInput } from '@/lib/shared/schemas/office';

const field = 'mt-1 block min-h-12 w-full rounded-md border-2 border-stone bg-white px-2 text-lg';
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
  const err = (n: 'farmId' | 'advisorId' | 'plannedOn' | 'notes') => errors[n] && <p className="mt-1 font-bold text-clay">{errors[n]?.message}</p>;
  return (
    <form aria-label="Plan a visit" noValidate onSubmit={handleSubmit((v) => onSubmit(v))} className="max-w-xl space-y-4">
      <div>
        <label htmlFor="farmId" className="block font-bold">
          Farm
        </label>
        <select id="farmId" className={field} aria-invalid={!!errors.farmId} {...register('farmId')}>
          <option value="">Choose a farm…</option>
          {farms.map((f) => (
            <option key={f.id} value={f.id}>
              {f.name}
            </option>
          ))}
        </select>
        {err('farmId')}
      </div>
      <div>
        <label htmlFor="advisorId" className="block font-bold">
          Advisor (optional)
        </label>
        <select id="advisorId" className={field} {...register('advisorId')}>
          <option value="">Not yet</option>
          {advisors.map((a) => (
            <option key={a.id} value={a.id}>
              {a.name}
            </option>
          ))}
        </select>
        {err('advisorId')}
      </div>
      <div>
        <label htmlFor="plannedOn" className="block font-bold">
          Planned date (optional)
        </label>
        <input id="plannedOn" type="date" className={field} {...register('plannedOn')} />
        {err('plannedOn')}
        <PastDayConfirm day={plannedOn} field={register('confirmPast')} />
      </div>
      <div>
        <label htmlFor="notes" className="block font-bold">
          Notes for the advisor
        </label>
        <textarea id="notes" rows={3} className={`${field} py-2`} {...register('notes')} />
        {err('notes')}
      </div>
      {serverError && (
        <p role="alert" className="font-bold text-clay">
          {serverError}
        </p>
      )}
      {duplicate && (
        <div role="alert" className="rounded-md border-2 border-ochre p-3">
          <p className="font-bold text-ochre">⚠ {duplicate}</p>
          <button
            type="button"
            onClick={() => onSubmit(visitCreateSchema.parse(getValues()), true)}
            className="mt-2 min-h-12 rounded-md border-2 border-ochre px-4 font-bold text-ochre"
          >
            Plan another visit anyway
          </button>
        </div>
      )}
      <button type="submit" disabled={isSubmitting} className="min-h-12 rounded-md bg-slate px-5 text-lg font-bold text-white disabled:opacity-70">
        {isSubmitting ? 'Saving…' : 'Plan the visit'}
      </button>
    </form>
  );
}
