'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useFieldArray, useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Input, Select } from '@/components/ui/control';
import { apiJson, applyFieldErrors } from '@/lib/client/api';
import type { PriceList } from '@/lib/shared/costs/price-list';
import { settingsSchema, type SettingsInput } from '@/lib/shared/schemas/office';

// The price list's boxes, grouped as a coordinator thinks of them; every default is invented (common practice, no source).
const PRICE_GROUPS: { title: string; fields: { key: keyof PriceList; label: string }[] }[] = [
  {
    title: 'Ram and parts',
    fields: [
      { key: 'ramPerInch', label: 'Ram, per inch of drive pipe' },
      { key: 'valve', label: 'Valve (gate or ball), each' },
      { key: 'gauge', label: 'Pressure gauge' },
      { key: 'unions', label: 'Pair of unions' },
      { key: 'base', label: 'Concrete base and anchor' },
      { key: 'reliefValve', label: 'Pressure-relief valve' },
      { key: 'standPipe', label: 'Stand pipe' },
      { key: 'intake', label: 'Intake screen and drum' },
      { key: 'tankPerL', label: 'Tank, per litre' },
    ],
  },
  {
    title: 'Pipe not on the pipe list, fittings and labour',
    fields: [
      { key: 'steelPipePerMmM', label: 'Steel pipe, per mm of bore per metre' },
      { key: 'plasticPipePerMmM', label: 'Plastic pipe, per mm of bore per metre' },
      { key: 'fittingsShare', label: 'Fittings, share of the pipe cost (0–1)' },
      { key: 'labourDayRate', label: 'Labour, per day' },
      { key: 'labourDaysPerPump', label: 'Days to set up a ram or pump' },
      { key: 'pipeMetresPerDay', label: 'Metres of pipe laid a day' },
    ],
  },
  {
    title: 'Ten-year comparison',
    fields: [
      { key: 'ramMaintenancePerYear', label: 'Ram upkeep a year' },
      { key: 'ramLifeYears', label: 'Ram life, years' },
      { key: 'solarPumpCapital', label: 'Solar pump and controller' },
      { key: 'solarPanelPerW', label: 'Solar panel, per watt' },
      { key: 'solarSunHours', label: 'Full-sun hours a day' },
      { key: 'solarWireToWater', label: 'Solar, panel-to-water efficiency (0–1)' },
      { key: 'solarLifeYears', label: 'Solar pump life, years' },
      { key: 'solarMaintenancePerYear', label: 'Solar upkeep a year' },
      { key: 'fuelPumpCapital', label: 'Petrol pump' },
      { key: 'fuelPumpLifeYears', label: 'Petrol pump life, years' },
      { key: 'fuelPricePerL', label: 'Petrol, per litre' },
      { key: 'fuelLitresPerHour', label: 'Petrol burnt, litres an hour' },
      { key: 'fuelPumpLpm', label: 'Petrol pump delivery at the lift, L/min' },
      { key: 'fuelMaintenancePerYear', label: 'Petrol pump upkeep a year' },
    ],
  },
];
export interface DemandKindView {
  kind: string;
  label: string;
  unit: string;
  catalogue: number;
}

/** The organisation's settings: units, design fraction, per-head demand overrides, pipe prices, the price list for costs. */
export function SettingsForm({ initial, kinds }: { initial: SettingsInput; kinds: DemandKindView[] }) {
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const { register, handleSubmit, formState, setError, control } = useForm<SettingsInput>({ resolver: zodResolver(settingsSchema), defaultValues: initial });
  const prices = useFieldArray({ control, name: 'pipePrices' });
  const { errors, isSubmitting } = formState;
  async function onSubmit(values: SettingsInput) {
    setMessage(null);
    // The resolver has already dropped blank per-head boxes ("use the catalogue figure").
    try {
      await apiJson('/api/organisation/settings', { method: 'PUT', body: values });
      setMessage({ ok: true, text: 'Settings saved. New screenings use them.' });
    } catch (error) {
      if (!applyFieldErrors(error, setError, ['unitsDefault', 'designFractionOfLowest', 'minProbabilityForGo']))
        setMessage({ ok: false, text: error instanceof Error ? error.message : 'Not saved.' });
    }
  }
  return (
    <form aria-label="Organisation settings" noValidate onSubmit={handleSubmit(onSubmit)} className="space-y-6">
      <div className="grid max-w-xl gap-4 sm:grid-cols-2">
        <div>
          <label htmlFor="unitsDefault" className="block font-bold">
            Units for new accounts
          </label>
          <Select id="unitsDefault" {...register('unitsDefault')}>
            <option value="metric">Metric (m, L)</option>
            <option value="us">US customary (ft, gal)</option>
          </Select>
        </div>
        <div>
          <label htmlFor="designFractionOfLowest" className="block font-bold">
            Design share of the lowest flow
          </label>
          <Input
            id="designFractionOfLowest"
            type="text"
            inputMode="decimal"
            className="figure"
            aria-describedby="fraction-help"
            {...register('designFractionOfLowest')}
          />
          <p id="fraction-help" className="text-stone">
            0.1–0.9 of the driest measured flow; the rest stays in the stream.
          </p>
          {errors.designFractionOfLowest && <p className="font-bold text-clay">{errors.designFractionOfLowest.message}</p>}
        </div>
        <div>
          <label htmlFor="minProbabilityForGo" className="block font-bold">
            Least chance of meeting the need for a plain go
          </label>
          <Input
            id="minProbabilityForGo"
            type="text"
            inputMode="decimal"
            className="figure"
            aria-describedby="chance-help"
            {...register('minProbabilityForGo')}
          />
          <p id="chance-help" className="text-stone">
            0.5–0.99; below it a site that meets the need on average is a go with conditions.
          </p>
          {errors.minProbabilityForGo && <p className="font-bold text-clay">{errors.minProbabilityForGo.message}</p>}
        </div>
      </div>
      <fieldset className="space-y-2">
        <legend className="text-lg font-bold">Daily water per head (L/day); blank uses the catalogue figure</legend>
        <div className="grid gap-2 sm:grid-cols-2 lg:grid-cols-3">
          {kinds.map((k) => (
            <label key={k.kind} className="block">
              <span className="block">
                {k.label}{' '}
                <span className="figure text-stone">
                  (catalogue {k.catalogue} L/{k.unit}/day)
                </span>
              </span>
              <Input type="text" inputMode="decimal" className="figure" {...register(`demandFigures.${k.kind}` as const)} />
              {errors.demandFigures?.[k.kind] && <span className="font-bold text-clay">{errors.demandFigures[k.kind]?.message}</span>}
            </label>
          ))}
        </div>
      </fieldset>
      <fieldset className="space-y-2">
        <legend className="text-lg font-bold">Pipe prices for the bill of materials</legend>
        {prices.fields.map((f, i) => (
          <div key={f.id} className="grid grid-cols-2 items-end gap-2 sm:grid-cols-5">
            <label className="block">
              Material
              <Input {...register(`pipePrices.${i}.material`)} />
            </label>
            <label className="block">
              Diameter (mm)
              <Input inputMode="decimal" className="figure" {...register(`pipePrices.${i}.diameterMm`)} />
            </label>
            <label className="block">
              Price per metre
              <Input inputMode="decimal" className="figure" {...register(`pipePrices.${i}.pricePerM`)} />
            </label>
            <label className="block">
              Currency
              <Input {...register(`pipePrices.${i}.currency`)} />
            </label>
            <Button variant="danger" size="sm" onClick={() => prices.remove(i)}>
              Remove
            </Button>
            {errors.pipePrices?.[i] && (
              <p className="col-span-full font-bold text-clay">
                {Object.values(errors.pipePrices[i] ?? {})
                  .map((e) => (e as { message?: string })?.message)
                  .filter(Boolean)
                  .join(' ')}
              </p>
            )}
          </div>
        ))}
        <Button variant="secondary" onClick={() => prices.append({ material: '', diameterMm: '', pricePerM: '', currency: 'GBP' } as never)}>
          Add a pipe price
        </Button>
      </fieldset>
      <fieldset className="space-y-3" aria-describedby="prices-help">
        <legend className="text-lg font-bold">Prices for the sheet&rsquo;s costs</legend>
        <p id="prices-help" className="max-w-prose text-stone">
          The farmer&rsquo;s sheet prices the bill of materials from these and compares ten years of a ram with a small solar pump and a petrol pump. The
          figures filled in at the start are invented (common practice, no source): put in your suppliers&rsquo; prices.
        </p>
        <label className="block max-w-xs">
          Currency (three letters, such as GBP, EUR, USD, KES)
          <Input className="uppercase" {...register('priceList.currency')} />
          {errors.priceList?.currency && <span className="font-bold text-clay">{errors.priceList.currency.message}</span>}
        </label>
        {PRICE_GROUPS.map((g) => (
          <div key={g.title}>
            <h3 className="font-bold">{g.title}</h3>
            <div className="grid gap-2 sm:grid-cols-2 lg:grid-cols-3">
              {g.fields.map((f) => (
                <label key={f.key} className="block">
                  {f.label}
                  <Input type="text" inputMode="decimal" className="figure" {...register(`priceList.${f.key}` as const)} />
                  {errors.priceList?.[f.key] && <span className="font-bold text-clay">{errors.priceList[f.key]?.message}</span>}
                </label>
              ))}
            </div>
          </div>
        ))}
      </fieldset>
      {message && (
        <p role={message.ok ? 'status' : 'alert'} className={`font-bold ${message.ok ? 'text-moss' : 'text-clay'}`}>
          {message.text}
        </p>
      )}
      <Button size="lg" type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Saving…' : 'Save settings'}
      </Button>
    </form>
  );
}
