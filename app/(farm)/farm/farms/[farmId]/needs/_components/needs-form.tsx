'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useFieldArray, useForm } from 'react-hook-form';
import type { z } from 'zod';
import { Button } from '@/components/ui/button';
import type { UnitSystem } from '@/lib/shared/domain';
import { farmNeedsBody } from '@/lib/shared/schemas/sheet';

interface FormValues {
  people: string;
  animals: { kind: string; count: string }[];
  gardenArea: string;
  gardenUnit: 'm2' | 'ft2';
  tankSite: string;
}

const input = 'min-h-12 w-full rounded-md border-2 border-stone bg-white px-3 text-xl';

/** The farmer's needs before a visit: household, animals by kind, garden, where the tank should go. */
export function NeedsForm({
  farmId,
  units,
  animalKinds,
  initial,
}: {
  farmId: string;
  units: UnitSystem;
  animalKinds: { kind: string; label: string }[];
  initial: FormValues;
}) {
  const [saved, setSaved] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const form = useForm<FormValues, unknown, z.output<typeof farmNeedsBody>>({
    resolver: zodResolver(farmNeedsBody as unknown as z.ZodType<z.output<typeof farmNeedsBody>, FormValues>),
    defaultValues: initial,
  });
  const animals = useFieldArray({ control: form.control, name: 'animals' });
  const errors = form.formState.errors;

  const submit = form.handleSubmit(async (values) => {
    setSaved(null);
    setError(null);
    const res = await fetch(`/api/farms/${farmId}/demand`, { method: 'PUT', headers: { 'content-type': 'application/json' }, body: JSON.stringify(values) });
    if (res.ok) setSaved('Saved. Your advisor will see these numbers.');
    else setError(((await res.json().catch(() => null)) as { error?: { message?: string } } | null)?.error?.message ?? 'Not saved; try again.');
  });

  return (
    <form onSubmit={submit} noValidate className="space-y-6 text-lg" aria-label="Water needs">
      <div className="space-y-1">
        <label htmlFor="people" className="block font-bold">
          People in the household
        </label>
        <input id="people" inputMode="decimal" {...form.register('people')} className={`${input} figure`} aria-invalid={!!errors.people} />
        {errors.people && <p className="text-clay">{errors.people.message}</p>}
      </div>
      <fieldset className="space-y-3">
        <legend className="font-bold">Animals</legend>
        {animals.fields.map((field, i) => (
          <div key={field.id} className="flex flex-wrap items-end gap-2">
            <label className="min-w-0 flex-1">
              <span className="block">Kind</span>
              <select {...form.register(`animals.${i}.kind`)} className={input}>
                {animalKinds.map((a) => (
                  <option key={a.kind} value={a.kind}>
                    {a.label}
                  </option>
                ))}
              </select>
            </label>
            <label className="w-28">
              <span className="block">How many</span>
              <input inputMode="decimal" {...form.register(`animals.${i}.count`)} className={`${input} figure`} aria-invalid={!!errors.animals?.[i]?.count} />
            </label>
            <Button variant="quiet" size="sm" onClick={() => animals.remove(i)} className="font-normal">
              Remove
            </Button>
            {errors.animals?.[i]?.count && <p className="w-full text-clay">{errors.animals[i]?.count?.message}</p>}
          </div>
        ))}
        {errors.animals?.message && <p className="text-clay">{errors.animals.message}</p>}
        <Button variant="secondary" onClick={() => animals.append({ kind: animalKinds[0]?.kind ?? 'goat', count: '' })}>
          Add animals
        </Button>
      </fieldset>
      <div className="space-y-1">
        <label htmlFor="garden" className="block font-bold">
          Garden to water
        </label>
        <div className="flex items-center gap-2">
          <input id="garden" inputMode="decimal" {...form.register('gardenArea')} className={`${input} figure`} aria-invalid={!!errors.gardenArea} />
          <span className="whitespace-nowrap">{units === 'us' ? 'sq ft' : 'm²'}</span>
        </div>
        {errors.gardenArea && <p className="text-clay">{errors.gardenArea.message}</p>}
      </div>
      <div className="space-y-1">
        <label htmlFor="tank" className="block font-bold">
          Where should the tank be?
        </label>
        <input id="tank" {...form.register('tankSite')} className={input} placeholder="e.g. on the bank above the house" />
        {errors.tankSite && <p className="text-clay">{errors.tankSite.message}</p>}
      </div>
      <Button type="submit" disabled={form.formState.isSubmitting} className="w-full text-lg">
        {form.formState.isSubmitting ? 'Saving…' : 'Save my needs'}
      </Button>
      {saved && (
        <p role="status" className="font-bold text-moss">
          {saved}
        </p>
      )}
      {error && (
        <p role="alert" className="font-bold text-clay">
          {error}
        </p>
      )}
    </form>
  );
}
