'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Input, Select, TextArea } from '@/components/ui/control';
import { Field } from '@/components/ui/field';
import { apiJson, applyFieldErrors } from '@/lib/client/api';
import { farmSchema, type FarmInput } from '@/lib/shared/schemas/office';

type Name = 'name' | 'area' | 'ownerId' | 'lat' | 'lon' | 'notes';

/** Adds or edits a farm: name, area, farmer, position (decimal degrees, "." or ","), notes. */
export function FarmForm({
  farm,
  farmers,
}: {
  farm?: { id: string; name: string; area: string; ownerId: string | null; lat: number | null; lon: number | null; notes: string };
  farmers: { id: string; name: string }[];
}) {
  const router = useRouter();
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<FarmInput>({
    resolver: zodResolver(farmSchema),
    defaultValues: {
      name: farm?.name ?? '',
      area: farm?.area ?? '',
      ownerId: farm?.ownerId ?? '',
      lat: farm?.lat ?? '',
      lon: farm?.lon ?? '',
      notes: farm?.notes ?? '',
    } as FarmInput,
  });
  const { errors, isSubmitting } = formState;
  async function onSubmit(values: FarmInput) {
    setMessage(null);
    try {
      if (farm) await apiJson(`/api/farms/${farm.id}`, { method: 'PATCH', body: values });
      else await apiJson('/api/farms', { method: 'POST', body: values });
      setMessage({ ok: true, text: 'Saved.' });
      router.push('/office/farms');
      router.refresh();
    } catch (error) {
      if (!applyFieldErrors(error, setError, ['name', 'area', 'ownerId', 'lat', 'lon', 'notes']))
        setMessage({ ok: false, text: error instanceof Error ? error.message : 'Not saved.' });
    }
  }
  const fieldMessage = (n: Name) => errors[n]?.message as string | undefined;
  return (
    <form aria-label={farm ? 'Edit the farm' : 'Add a farm'} noValidate onSubmit={handleSubmit(onSubmit)} className="max-w-xl space-y-4">
      <Field id="name" label="Name" message={fieldMessage('name')}>
        {(control) => <Input {...control} {...register('name')} />}
      </Field>
      <Field id="area" label="Area" message={fieldMessage('area')}>
        {(control) => <Input {...control} {...register('area')} />}
      </Field>
      <Field id="ownerId" label="Farmer" message={fieldMessage('ownerId')}>
        {(control) => (
          <Select {...control} {...register('ownerId')}>
            <option value="">No account yet</option>
            {farmers.map((f) => (
              <option key={f.id} value={f.id}>
                {f.name}
              </option>
            ))}
          </Select>
        )}
      </Field>
      <div className="grid grid-cols-2 gap-3">
        <Field id="lat" label="Latitude (°)" message={fieldMessage('lat')}>
          {(control) => <Input {...control} type="text" inputMode="decimal" className="figure" {...register('lat')} />}
        </Field>
        <Field id="lon" label="Longitude (°)" message={fieldMessage('lon')}>
          {(control) => <Input {...control} type="text" inputMode="decimal" className="figure" {...register('lon')} />}
        </Field>
      </div>
      <Field id="notes" label="Notes" message={fieldMessage('notes')}>
        {(control) => <TextArea {...control} rows={3} {...register('notes')} />}
      </Field>
      {message && (
        <p role={message.ok ? 'status' : 'alert'} className={`font-bold ${message.ok ? 'text-moss' : 'text-clay'}`}>
          {message.text}
        </p>
      )}
      <Button type="submit" size="lg" disabled={isSubmitting}>
        {isSubmitting ? 'Saving…' : 'Save the farm'}
      </Button>
    </form>
  );
}
