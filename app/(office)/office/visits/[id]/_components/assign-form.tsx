'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { ApiError, apiJson, applyFieldErrors } from '@/lib/client/api';
import { PastDayConfirm } from '@/components/past-day-confirm';
import { visitAssignSchema, type VisitAssignInput } from '@/lib/shared/schemas/office';
import { Input, Select } from '@/components/ui/control';
import { Button } from '@/components/ui/button';

/** Assign or reassign the visit; the server's "may hold unsynced data" answer becomes a warning to confirm. */
export function AssignForm({
  visitId,
  advisors,
  current,
  mayBeUnsynced,
}: {
  visitId: string;
  advisors: { id: string; name: string }[];
  current: { advisorId: string | null; plannedOn: string | null };
  mayBeUnsynced: boolean;
}) {
  const router = useRouter();
  const [warning, setWarning] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const [serverError, setServerError] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError, getValues, control } = useForm<VisitAssignInput>({
    resolver: zodResolver(visitAssignSchema),
    defaultValues: { advisorId: current.advisorId ?? '', plannedOn: current.plannedOn ?? '', confirmPast: false, confirmUnsynced: false },
  });
  const { errors, isSubmitting } = formState;
  const plannedOn = useWatch({ control, name: 'plannedOn' }) as string | null | undefined;

  async function send(values: VisitAssignInput, confirmUnsynced: boolean) {
    setServerError(null);
    setDone(null);
    try {
      const { visit } = await apiJson<{ visit: { noticeSent: boolean } }>(`/api/visits/${visitId}/assignment`, {
        method: 'PUT',
        body: { ...values, confirmUnsynced },
      });
      setWarning(null);
      setDone(visit.noticeSent ? 'Saved. The advisor has been e-mailed; the visit is on their phone at its next sync.' : 'Saved.');
      router.refresh();
    } catch (error) {
      if (error instanceof ApiError && error.code === 'unsynced') setWarning(error.message);
      else if (!applyFieldErrors(error, setError, ['advisorId', 'plannedOn'])) setServerError(error instanceof Error ? error.message : 'Not saved.');
    }
  }

  return (
    <form
      aria-label="Assign the visit"
      noValidate
      onSubmit={handleSubmit((v) => send(v, false))}
      className="space-y-4 rounded-md border border-rule bg-white p-4"
    >
      {mayBeUnsynced && (
        <p className="rounded-md border-2 border-ochre p-3 font-bold text-ochre">
          ⚠ Nothing has synced from this visit since its planned day: the advisor’s phone may hold readings the office has not seen.
        </p>
      )}
      <div className="grid gap-4 sm:grid-cols-2">
        <div>
          <label htmlFor="advisorId" className="block font-bold">
            Advisor
          </label>
          <Select
            id="advisorId"

            aria-invalid={!!errors.advisorId}
            aria-describedby={errors.advisorId ? 'advisorId-error' : undefined}
            {...register('advisorId')}
          >
            <option value="">Choose an advisor…</option>
            {advisors.map((a) => (
              <option key={a.id} value={a.id}>
                {a.name}
              </option>
            ))}
          </Select>
          {errors.advisorId && (
            <p id="advisorId-error" className="mt-1 font-bold text-clay">
              {errors.advisorId.message}
            </p>
          )}
        </div>
        <div>
          <label htmlFor="plannedOn" className="block font-bold">
            Planned date
          </label>
          <Input
            id="plannedOn"
            type="date"

            aria-invalid={!!errors.plannedOn}
            aria-describedby={errors.plannedOn ? 'plannedOn-error' : undefined}
            {...register('plannedOn')}
          />
          {errors.plannedOn && (
            <p id="plannedOn-error" className="mt-1 font-bold text-clay">
              {errors.plannedOn.message}
            </p>
          )}
          <PastDayConfirm day={plannedOn} field={register('confirmPast')} />
        </div>
      </div>
      <Button size="lg" type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Saving…' : current.advisorId ? 'Save assignment' : 'Assign'}
      </Button>
      {warning && (
        <div role="alert" className="rounded-md border-2 border-ochre p-3">
          <p className="font-bold text-ochre">⚠ {warning}</p>
          <Button variant="caution" className="mt-2" onClick={() => send(getValues(), true)}>
            Reassign anyway
          </Button>
        </div>
      )}
      {serverError && (
        <p role="alert" className="font-bold text-clay">
          {serverError}
        </p>
      )}
      {done && (
        <p role="status" className="font-bold text-moss">
          {done}
        </p>
      )}
    </form>
  );
}
