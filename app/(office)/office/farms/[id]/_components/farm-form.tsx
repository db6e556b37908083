'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { apiJson, applyFieldErrors } from '@/lib/client/api';
import { farmSchema, type FarmInput } from '@/lib/shared/schemas/office';

const field = 'mt-1 block min-h-12 w-full rounded-md border-2 border-stone bg-white px-2 text-lg';
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
  const err = (n: Name) => errors[n] && <p className="mt-1 font-bold text-clay">{errors[n]?.message as string}</p>;
  return (
    <form aria-label={farm ? 'Edit the farm' : 'Add a farm'} noValidate onSubmit={handleSubmit(onSubmit)} className="max-w-xl space-y-4">
      <div>
        <label htmlFor="name" className="block font-bold">
          Name
        </label>
        <input id="name" className={field} aria-invalid={!!errors.name} {...register('name')} />
        {err('name')}
      </div>
      <div>
        <label htmlFor="area" className="block font-bold">
          Area
        </label>
        <input id="area" className={field} {...register('area')} />
        {err('area')}
      </div>
      <div>
        <label htmlFor="ownerId" className="block font-bold">
          Farmer
        </label>
        <select id="ownerId" className={field} {...register('ownerId')}>
          <option value="">No account yet</option>
          {farmers.map((f) => (
            <option key={f.id} value={f.id}>
              {f.name}
            </option>
          ))}
        </select>
        {err('ownerId')}
      </div>
      <div className="grid grid-cols-2 gap-3">
        <div>
          <label htmlFor="lat" className="block font-bold">
            Latitude (°)
          </label>
          <input id="lat" type="text" inputMode="decimal" className={`${field} figure`} {...register('lat')} />
          {err('lat')}
        </div>
        <div>
          <label htmlFor="lon" className="block font-bold">
            Longitude (°)
          </label>
          <input id="lon" type="text" inputMode="decimal" className={`${field} figure`} {...register('lon')} />
          {err('lon')}
        </div>
      </div>
      <div>
        <label htmlFor="notes" className="block font-bold">
          Notes
        </label>
        <textarea id="notes" rows={3} className={`${field} py-2`} {...register('notes')} />
        {err('notes')}
      </div>
      {message && (
        <p role={message.ok ? 'status' : 'alert'} className={`font-bold ${message.ok ? 'text-moss' : 'text-clay'}`}>
          {message.text}
        </p>
      )}
      <button type="submit" disabled={isSubmitting} className="min-h-12 rounded-md bg-slate px-5 text-lg font-bold text-white disabled:opacity-70">
        {isSubmitting ? 'Saving…' : 'Save the farm'}
      </button>
    </form>
  );
}
