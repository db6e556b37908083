'use client';

import { useFieldQuery } from '../../_components/use-field-query';
import { Suspense, useEffect, useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { Card } from '@/components/ui/card';
import { Select } from '@/components/ui/control';
import { PIPE_MATERIALS, type PipeMaterialId } from '@/lib/engine/materials';
import { fieldDb, type LocalRecord } from '@/lib/client/db';
import { setDirty } from '@/lib/client/dirty';
import { loadRecordChecks, useRecordChecksOnFirstUse } from '@/lib/client/load-record-checks';
import type { PipeRunsValues as Values } from '@/lib/client/record-checks';
import { newId } from '@/lib/client/ids';
import { deleteRecord, saveRecord } from '@/lib/client/outbox';
import { announceSave } from '@/lib/client/sync/triggers';
import type { UnitSystem } from '@/lib/shared/domain';
import { PrimaryButton, SectionHeader } from '../../_components/choice';
import { NumberField } from '../../_components/number-field';
import { useVisitId } from '../../_components/use-field-data';
import { WithUnits } from '../../_components/with-units';

const MATERIALS = Object.values(PIPE_MATERIALS);

function PipeFields({
  name,
  title,
  control,
  units,
  hint,
}: {
  name: 'drive' | 'delivery' | 'feed';
  title: string;
  control: ReturnType<typeof useForm<Values>>['control'];
  units: UnitSystem;
  hint: string;
}) {
  return (
    <Card as="fieldset" tone="field" padding="md" className="space-y-3">
      <legend className="px-1 text-xl font-bold">{title}</legend>
      <p className="text-stone">{hint}</p>
      <Controller
        control={control}
        name={`${name}.lengthM`}
        render={({ field, fieldState }) => (
          <>
            <NumberField label="Length along the route" quantity="length" units={units} value={field.value} onChange={field.onChange}>
              {fieldState.error && (
                <p role="alert" className="font-bold text-clay">
                  {fieldState.error.message}
                </p>
              )}
            </NumberField>
          </>
        )}
      />
      <Controller
        control={control}
        name={`${name}.diameterMm`}
        render={({ field, fieldState }) => (
          <NumberField
            label="Inside diameter (leave empty: the screen proposes one)"
            quantity="diameter"
            units={units}
            value={field.value}
            onChange={field.onChange}
          >
            {fieldState.error && (
              <p role="alert" className="font-bold text-clay">
                {fieldState.error.message}
              </p>
            )}
          </NumberField>
        )}
      />
      <Controller
        control={control}
        name={`${name}.material`}
        render={({ field }) => (
          <div>
            <label htmlFor={`${name}-material`} className="block font-bold">
              Material
            </label>
            <Select
              look="phone"
              className="mt-1 text-lg"
              id={`${name}-material`}
              value={field.value}
              onChange={(e) => field.onChange(e.target.value as PipeMaterialId)}
            >
              {MATERIALS.map((m) => (
                <option key={m.id} value={m.id}>
                  {m.label}
                </option>
              ))}
            </Select>
          </div>
        )}
      />
    </Card>
  );
}

function PipesForm({ visitId, existing, units }: { visitId: string; existing: LocalRecord<'pipeRun'>[]; units: UnitSystem }) {
  const find = (purpose: 'drive' | 'delivery' | 'feed') => existing.find((p) => p.purpose === purpose);
  const [message, setMessage] = useState<string | null>(null);
  useRecordChecksOnFirstUse();
  const { control, handleSubmit, formState, reset } = useForm<Values>({
    resolver: async (values, context, options) => (await loadRecordChecks()).pipeRunsResolver(units)(values, context, options),
    defaultValues: {
      drive: {
        lengthM: find('drive')?.lengthM ?? undefined,
        diameterMm: find('drive')?.diameterMm ?? undefined,
        material: find('drive')?.material ?? 'galvanized-steel',
      },
      delivery: {
        lengthM: find('delivery')?.lengthM ?? undefined,
        diameterMm: find('delivery')?.diameterMm ?? undefined,
        material: find('delivery')?.material ?? 'hdpe',
      },
      feed: { lengthM: find('feed')?.lengthM ?? undefined, diameterMm: find('feed')?.diameterMm ?? undefined, material: find('feed')?.material ?? 'hdpe' },
    },
  });
  useEffect(() => {
    setDirty('pipes', formState.isDirty);
    return () => setDirty('pipes', false);
  }, [formState.isDirty]);

  async function save(values: Values) {
    for (const purpose of ['drive', 'delivery', 'feed'] as const) {
      const v = values[purpose];
      // No feed pipe unless its length is given: an empty section removes one saved before.
      if (purpose === 'feed' && v.lengthM === undefined) {
        const old = find('feed');
        if (old) await deleteRecord('pipeRun', old.id);
        continue;
      }
      await saveRecord(
        'pipeRun',
        find(purpose)?.id ?? newId(),
        {
          visitId,
          purpose,
          lengthM: v.lengthM ?? null,
          diameterMm: v.diameterMm ?? null,
          material: v.material,
          pressureClass: find(purpose)?.pressureClass ?? null,
        },
        units,
      );
    }
    // What is saved is no longer unsaved input: leaving the page now asks nothing.
    reset(values);
    setMessage('Pipe runs saved on this phone.');
    announceSave();
  }
  return (
    <form onSubmit={handleSubmit(save)} className="space-y-4" noValidate>
      <PipeFields
        name="drive"
        title="Drive pipe (intake → ram)"
        control={control}
        units={units}
        hint="Rigid pipe; leave the length empty to let the screen propose one from the fall."
      />
      <PipeFields name="delivery" title="Delivery pipe (ram → tank)" control={control} units={units} hint="Measure along the ground, including bends." />
      <PipeFields
        name="feed"
        title="Feed pipe (intake → stand pipe), gentle creeks only"
        control={control}
        units={units}
        hint="Where the drive pipe starts at an open stand pipe below the intake; leave the length empty when the drive pipe starts at the intake."
      />
      {message && (
        <p role="status" className="font-bold">
          {message}
        </p>
      )}
      <PrimaryButton type="submit">Save pipe runs</PrimaryButton>
    </form>
  );
}

function PipesPage({ units }: { units: UnitSystem }) {
  const visitId = useVisitId();
  const existing = useFieldQuery(async () => (await fieldDb().pipeRuns.where('visitId').equals(visitId).toArray()).filter((p) => !p.deletedAt), [visitId]);
  return (
    <div className="space-y-5">
      <SectionHeader visitId={visitId} title="Pipe runs" />
      {existing && <PipesForm visitId={visitId} existing={existing} units={units} />}
    </div>
  );
}

export default function Page() {
  return (
    <Suspense>
      <WithUnits title="Pipe runs">{(units) => <PipesPage units={units} />}</WithUnits>
    </Suspense>
  );
}
