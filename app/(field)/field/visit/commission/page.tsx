'use client';

import { Suspense, useState } from 'react';
import { commissioningCheck, EngineInputError, type CommissioningResult } from '@/lib/engine';
import { ApiError, apiJson } from '@/lib/client/api';
import { PrimaryButton, SectionHeader } from '../../_components/choice';
import { NumberField } from '../../_components/number-field';
import { useUnits, useVisitId } from '../../_components/use-field-data';
import { showQuantity } from '@/lib/shared/quantities';

const OUTCOMES: Record<string, string> = {
  'as-predicted': 'Within the range the screen predicted.',
  'above-band': 'Above the range the screen predicted.',
  short: 'Short of the range the screen predicted.',
  'well-short': 'Well short: under half of what the screen predicted.',
};

/** Commissioning check: efficiencies at once on the phone; stored and compared with the screening when sent. */
function CommissionPage() {
  const visitId = useVisitId();
  const units = useUnits();
  const [driveLps, setDriveLps] = useState<number | undefined>();
  const [deliveredLps, setDeliveredLps] = useState<number | undefined>();
  const [beats, setBeats] = useState<number | undefined>();
  const [liftM, setLiftM] = useState<number | undefined>();
  const [fallM, setFallM] = useState<number | undefined>();
  const [check, setCheck] = useState<CommissioningResult | null>(null);
  const [message, setMessage] = useState<string | null>(null);

  let local: CommissioningResult | null = null;
  let problem: string | null = null;
  if (driveLps && deliveredLps && beats && liftM && fallM) {
    try {
      local = commissioningCheck({ driveLpm: driveLps * 60, deliveredLpm: deliveredLps * 60, beatsPerMinute: beats, liftM, fallM });
    } catch (error) {
      problem = error instanceof EngineInputError ? error.message : 'These readings cannot be checked.';
    }
  }

  async function send() {
    if (!driveLps || !deliveredLps || !beats || !liftM) return setMessage('Drive flow, delivered flow, beats and lift are needed.');
    try {
      const body = { driveLpm: driveLps * 60, deliveredLpm: deliveredLps * 60, beatsPerMinute: beats, liftM, ...(fallM ? { fallM } : {}) };
      const res = await apiJson<{ commissioning: { check: CommissioningResult } }>(`/api/visits/${visitId}/commissioning`, { method: 'POST', body });
      setCheck(res.commissioning.check);
      setMessage('Recorded: the visit is now commissioned.');
    } catch (error) {
      setMessage(error instanceof ApiError ? error.message : 'Could not send the check.');
    }
  }

  const shown = check ?? local;
  return (
    <div className="space-y-5">
      <SectionHeader visitId={visitId} title="Commissioning check" />
      <p className="text-stone">At the running ram: catch the waste and the delivery (bucket at the tank) to get the drive flow, count the beats for a minute, measure the lift and the fall.</p>
      <div className="grid gap-3 sm:grid-cols-2">
        <NumberField label="Drive flow (waste + delivered)" quantity="flowLps" units={units} value={driveLps} onChange={setDriveLps} />
        <NumberField label="Delivered flow at the tank" quantity="flowLps" units={units} value={deliveredLps} onChange={setDeliveredLps} />
        <NumberField label="Beats per minute" quantity="count" units={units} value={beats} onChange={setBeats} />
        <NumberField label="Lift from the ram to the outlet" quantity="length" units={units} value={liftM} onChange={setLiftM} />
        <NumberField label="Fall to the ram (empty: the screening's)" quantity="length" units={units} value={fallM} onChange={setFallM} />
      </div>
      {problem && <p role="alert" className="font-bold text-clay">{problem}</p>}
      {shown && (
        <section aria-labelledby="check" className="rounded-md border-2 border-slate bg-white p-4" data-testid="commission-check">
          <h2 id="check" className="text-xl font-bold">What the ram does</h2>
          <p>Ram efficiency (D&rsquo;Aubuisson) <span className="figure font-bold">{Math.round(shown.daubuissonEfficiency * 100)} %</span> · Rankine <span className="figure font-bold">{Math.round(shown.rankineEfficiency * 100)} %</span></p>
          <p>Delivers <span className="figure">{showQuantity(shown.measuredLpd, 'litresPerDay', units)}</span>{shown.prediction ? <> against <span className="figure">{showQuantity(shown.prediction.deliveryLpd, 'litresPerDay', units)}</span> predicted</> : null}</p>
          {shown.outcome && <p className="font-bold">{OUTCOMES[shown.outcome]}</p>}
          {shown.causes.length > 0 && (
            <>
              <h3 className="mt-2 font-bold">Worth checking</h3>
              <ul className="ml-5 list-disc">{shown.causes.map((c) => <li key={c.code}>{c.text}</li>)}</ul>
            </>
          )}
        </section>
      )}
      {message && <p role="status" className="font-bold">{message}</p>}
      <PrimaryButton onClick={send}>Record the check (needs a connection)</PrimaryButton>
      <p className="text-sm text-stone">Keep clear of the waste valve while the ram runs; surge pressure can burst fittings. Repairs follow local codes and licensed practice.</p>
    </div>
  );
}

export default function Page() {
  return <Suspense><CommissionPage /></Suspense>;
}
