'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ApiError, apiJson, applyFieldErrors } from '@/lib/client/api';
import { AdvisorAndDayFields } from '../../../_components/advisor-and-day-fields';
import { visitAssignSchema, type VisitAssignInput } from '@/lib/shared/schemas/office';

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
    <Card as="form" aria-label="Assign the visit" noValidate onSubmit={handleSubmit((v) => send(v, false))} className="space-y-4">
      {mayBeUnsynced && (
        <p className="rounded-md border-2 border-ochre p-3 font-bold text-ochre">
          ⚠ Nothing has synced from this visit since its planned day: the advisor’s phone may hold readings the office has not seen.
        </p>
      )}
      <div className="grid gap-4 sm:grid-cols-2">
        <AdvisorAndDayFields
          advisors={advisors}
          advisor={{ field: register('advisorId'), label: 'Advisor', none: 'Choose an advisor…', message: errors.advisorId?.message }}
          day={{
            field: register('plannedOn'),
            label: 'Planned date',
            message: errors.plannedOn?.message,
            confirmPast: register('confirmPast'),
            value: plannedOn,
          }}
        />
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
    </Card>
  );
}
