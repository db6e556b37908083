'use client';

import { Suspense, useEffect, useState } from 'react';
import { useFieldQuery } from '../../_components/use-field-query';
import { Card } from '@/components/ui/card';
import {
  ASSUMED_STROKE_MM,
  commissioningCheck,
  designPointFromFigures,
  EngineInputError,
  screenSite,
  type CommissioningResult,
  type DesignPoint,
} from '@/lib/engine';
import { localSiteReadings } from '@/lib/client/site-readings';
import { siteReadingsSchema } from '@/lib/shared/schemas/site-readings';
import { setDirty } from '@/lib/client/dirty';
import { newId } from '@/lib/client/ids';
import { QuotaError, saveRecord } from '@/lib/client/outbox';
import { announceSave } from '@/lib/client/sync/triggers';
import { commissioningInputSchema } from '@/lib/shared/schemas/commissioning';
import { showQuantity } from '@/lib/shared/display/quantities';
import { PrimaryButton, SectionHeader } from '../../_components/choice';
import { NumberField } from '../../_components/number-field';
import { useVisitId } from '../../_components/use-field-data';
import { WithUnits } from '../../_components/with-units';
import type { UnitSystem } from '@/lib/shared/domain';
import { CheckSummary } from './_components/check-summary';
import { RecordedChecks } from './_components/recorded-checks';

/**
 * Commissioning check: efficiencies at once on the phone; the record is kept on the phone and queued
 * in the outbox, so it survives no signal; the server stores it and compares it with the screening when it arrives.
 */
function CommissionPage({ units }: { units: UnitSystem }) {
  const visitId = useVisitId();
  const [driveLps, setDriveLps] = useState<number | undefined>();
  const [deliveredLps, setDeliveredLps] = useState<number | undefined>();
  const [beats, setBeats] = useState<number | undefined>();
  const [liftM, setLiftM] = useState<number | undefined>();
  const [fallM, setFallM] = useState<number | undefined>();
  const [strokeMm, setStrokeMm] = useState<number | undefined>();
  const [message, setMessage] = useState<string | null>(null);
  // The drive pipe and design drive flow from the phone's own screen of the visit, so the valve advice needs no signal.
  const design = useFieldQuery(async (): Promise<DesignPoint | null> => {
    const input = await localSiteReadings(visitId);
    const parsed = input ? siteReadingsSchema.safeParse(input) : null;
    if (!parsed?.success) return null;
    try {
      return designPointFromFigures(screenSite(parsed.data).figures);
    } catch {
      return null;
    }
  }, [visitId]);

  const typed = [driveLps, deliveredLps, beats, liftM, fallM, strokeMm].some((v) => v !== undefined);
  useEffect(() => {
    setDirty('commission', typed);
    return () => setDirty('commission', false);
  }, [typed]);

  let local: CommissioningResult | null = null;
  let problem: string | null = null;
  if (driveLps && deliveredLps && beats && liftM && fallM) {
    try {
      local = commissioningCheck(
        {
          driveLpm: driveLps * 60,
          deliveredLpm: deliveredLps * 60,
          beatsPerMinute: beats,
          liftM,
          fallM,
          ...(strokeMm ? { wasteValveStrokeMm: strokeMm } : {}),
        },
        null,
        design ?? null,
      );
    } catch (error) {
      problem = error instanceof EngineInputError ? error.message : 'These readings cannot be checked.';
    }
  }

  async function record() {
    const parsed = commissioningInputSchema.safeParse({
      driveLpm: driveLps === undefined ? undefined : driveLps * 60,
      deliveredLpm: deliveredLps === undefined ? undefined : deliveredLps * 60,
      beatsPerMinute: beats,
      liftM,
      ...(fallM === undefined ? {} : { fallM }),
      ...(strokeMm === undefined ? {} : { wasteValveStrokeMm: strokeMm }),
    });
    if (!parsed.success) return setMessage(parsed.error.issues.map((i) => i.message).join('; ') + '.');
    const input = parsed.data;
    try {
      await saveRecord('commissioning', newId(), {
        visitId,
        driveLpm: input.driveLpm,
        deliveredLpm: input.deliveredLpm,
        beatsPerMinute: input.beatsPerMinute,
        liftM: input.liftM,
        fallM: input.fallM ?? null,
        drivePipeMaterial: input.drivePipeMaterial ?? null,
        wasteValveStrokeMm: input.wasteValveStrokeMm ?? null,
        notes: input.notes,
      });
    } catch (error) {
      return setMessage(error instanceof QuotaError ? error.message : 'Could not save the check on this phone.');
    }
    setDriveLps(undefined);
    setDeliveredLps(undefined);
    setBeats(undefined);
    setLiftM(undefined);
    setFallM(undefined);
    setMessage('Check saved on this phone: it goes to the server with the next sync.');
    announceSave();
  }

  return (
    <div className="space-y-5">
      <SectionHeader visitId={visitId} title="Commissioning check" />
      <p className="text-stone">
        At the running ram: catch the waste and the delivery (bucket at the tank) to get the drive flow, count the beats for a minute, measure the lift and the
        fall.
      </p>
      <div className="grid gap-3 sm:grid-cols-2">
        <NumberField label="Drive flow (waste + delivered)" quantity="flowLps" units={units} value={driveLps} onChange={setDriveLps} />
        <NumberField label="Delivered flow at the tank" quantity="flowLps" units={units} value={deliveredLps} onChange={setDeliveredLps} />
        <NumberField label="Beats per minute" quantity="count" units={units} value={beats} onChange={setBeats} />
        <NumberField label="Lift from the ram to the outlet" quantity="length" units={units} value={liftM} onChange={setLiftM} />
        <NumberField label="Fall to the ram (empty: the screening's)" quantity="length" units={units} value={fallM} onChange={setFallM} />
        <NumberField
          label="Waste valve stroke (empty: not measured)"
          quantity="stroke"
          units={units}
          value={strokeMm}
          onChange={setStrokeMm}
          hint={`How far the valve travels from open to shut. Without it the advice assumes ${showQuantity(ASSUMED_STROKE_MM, 'stroke', units)}, the middle of the usual ${showQuantity(10, 'stroke', units, false)}–${showQuantity(25, 'stroke', units)}.`}
        />
      </div>
      {problem && (
        <p role="alert" className="font-bold text-clay">
          {problem}
        </p>
      )}
      {local && (
        <Card as="section" tone="strong" aria-labelledby="check" data-testid="commission-check">
          <h2 id="check" className="text-xl font-bold">
            What the ram does
          </h2>
          <CheckSummary check={local} units={units} />
        </Card>
      )}
      {message && (
        <p role="status" className="font-bold">
          {message}
        </p>
      )}
      <PrimaryButton onClick={record}>Record the check</PrimaryButton>
      <p className="text-sm text-stone">
        Works with no signal: the check is kept on this phone until the server has it. Keep clear of the waste valve while the ram runs; surge pressure can
        burst fittings. Repairs follow local codes and licensed practice.
      </p>
      <RecordedChecks visitId={visitId} units={units} design={design ?? null} />
    </div>
  );
}

export default function Page() {
  return (
    <Suspense>
      <WithUnits title="Commissioning check">{(units) => <CommissionPage units={units} />}</WithUnits>
    </Suspense>
  );
}
