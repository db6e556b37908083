'use client';

import type { CommissioningResult } from '@/lib/engine';
import type { UnitSystem } from '@/lib/shared/domain';
import { showQuantity } from '@/lib/shared/display/quantities';

const OUTCOMES: Record<string, string> = {
  'as-predicted': 'Within the range the screen predicted.',
  'above-band': 'Above the range the screen predicted.',
  short: 'Short of the range the screen predicted.',
  'well-short': 'Well short: under half of what the screen predicted.',
};

/** What the engine makes of one set of commissioning readings: efficiencies, delivery, likely causes. */
export function CheckSummary({ check, units }: { check: CommissioningResult; units: UnitSystem }) {
  return (
    <>
      <p>Ram efficiency (D&rsquo;Aubuisson) <span className="figure font-bold">{Math.round(check.daubuissonEfficiency * 100)} %</span> · Rankine <span className="figure font-bold">{Math.round(check.rankineEfficiency * 100)} %</span></p>
      <p>Delivers <span className="figure">{showQuantity(check.measuredLpd, 'litresPerDay', units)}</span>{check.prediction ? <> against <span className="figure">{showQuantity(check.prediction.deliveryLpd, 'litresPerDay', units)}</span> predicted</> : null}</p>
      {check.outcome && <p className="font-bold">{OUTCOMES[check.outcome]}</p>}
      {check.causes.length > 0 && (
        <>
          <h3 className="mt-2 font-bold">Worth checking</h3>
          <ul className="ml-5 list-disc">{check.causes.map((c) => <li key={c.code}>{c.text}</li>)}</ul>
        </>
      )}
    </>
  );
}
