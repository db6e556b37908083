'use client';

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { PastDayConfirm } from '@/components/past-day-confirm';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Input, Select } from '@/components/ui/control';
import { ApiError, apiJson } from '@/lib/client/api';
import type { Option } from './visit-filters';

/** Assigns the ticked visits to one advisor and date; asks again when some may hold unsynced data. */
export function BulkAssign({ visitIds, advisors, onDone }: { visitIds: string[]; advisors: Option[]; onDone: () => void }) {
  const queryClient = useQueryClient();
  const [advisorId, setAdvisorId] = useState('');
  const [plannedOn, setPlannedOn] = useState('');
  const [confirmPast, setConfirmPast] = useState(false);
  const [warning, setWarning] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const mutation = useMutation({
    mutationFn: (confirmUnsynced: boolean) =>
      apiJson<{ assigned: number; noticeSent: boolean }>('/api/visits/assignments', {
        method: 'POST',
        body: { visitIds, advisorId, plannedOn, confirmPast, confirmUnsynced },
      }),
    onSuccess: (result) => {
      setWarning(null);
      setMessage(`${result.assigned} ${result.assigned === 1 ? 'visit' : 'visits'} assigned.${result.noticeSent ? ' The advisor has been e-mailed.' : ''}`);
      void queryClient.invalidateQueries({ queryKey: ['visits'] });
      onDone();
    },
    onError: (error) => {
      if (error instanceof ApiError && error.code === 'unsynced') setWarning(error.message);
    },
  });
  const error = mutation.error instanceof ApiError && mutation.error.code !== 'unsynced' ? mutation.error : null;

  if (visitIds.length === 0) {
    return message ? (
      <p role="status" className="font-bold text-moss">
        {message}
      </p>
    ) : null;
  }
  return (
    <Card as="section" aria-label="Assign ticked visits" tone="strong" padding="md">
      <h3 className="font-bold">
        Assign {visitIds.length} ticked {visitIds.length === 1 ? 'visit' : 'visits'}
      </h3>
      <div className="mt-2 grid gap-3 sm:grid-cols-3">
        <label className="block font-bold">
          Advisor
          <Select className="text-base" value={advisorId} onChange={(e) => setAdvisorId(e.target.value)} aria-invalid={!!error?.fieldErrors.advisorId}>
            <option value="">Choose…</option>
            {advisors.map((a) => (
              <option key={a.id} value={a.id}>
                {a.name}
              </option>
            ))}
          </Select>
          {error?.fieldErrors.advisorId && <span className="block text-clay">{error.fieldErrors.advisorId[0]}</span>}
        </label>
        <label className="block font-bold">
          Planned date
          <Input
            type="date"
            className="text-base"
            value={plannedOn}
            onChange={(e) => setPlannedOn(e.target.value)}
            aria-invalid={!!error?.fieldErrors.plannedOn}
          />
          {error?.fieldErrors.plannedOn && <span className="block text-clay">{error.fieldErrors.plannedOn[0]}</span>}
          <PastDayConfirm day={plannedOn} checked={confirmPast} onChange={setConfirmPast} />
        </label>
        <div className="flex items-end">
          <Button disabled={mutation.isPending} onClick={() => mutation.mutate(false)} className="w-full">
            {mutation.isPending ? 'Assigning…' : 'Assign'}
          </Button>
        </div>
      </div>
      {error && !error.fieldErrors.advisorId && !error.fieldErrors.plannedOn && (
        <p role="alert" className="mt-2 font-bold text-clay">
          {error.message}
        </p>
      )}
      {warning && (
        <div role="alert" className="mt-3 rounded-md border-2 border-ochre p-3">
          <p className="font-bold text-ochre">⚠ {warning}</p>
          <Button variant="caution" onClick={() => mutation.mutate(true)} className="mt-2">
            Reassign anyway
          </Button>
        </div>
      )}
    </Card>
  );
}
