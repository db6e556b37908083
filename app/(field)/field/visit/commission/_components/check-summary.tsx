'use client';

import type { CommissioningResult } from '@/lib/engine';
import type { UnitSystem } from '@/lib/shared/domain';
import { renderMessage } from '@/lib/shared/display/message';
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
      <p>
        Ram efficiency (D&rsquo;Aubuisson) <span className="figure font-bold">{Math.round(check.daubuissonEfficiency * 100)} %</span> · Rankine{' '}
        <span className="figure font-bold">{Math.round(check.rankineEfficiency * 100)} %</span>
      </p>
      <p>
        Delivers <span className="figure">{showQuantity(check.measuredLpd, 'litresPerDay', units)}</span>
        {check.prediction ? (
          <>
            {' '}
            against <span className="figure">{showQuantity(check.prediction.deliveryLpd, 'litresPerDay', units)}</span> predicted
          </>
        ) : null}
      </p>
      {check.outcome && <p className="font-bold">{OUTCOMES[check.outcome]}</p>}
      {check.valve && (
        <div data-testid="valve-advice" className="mt-2">
          <h3 className="font-bold">Waste valve</h3>
          <p>{check.valve.message ? renderMessage(check.valve.message, units) : check.valve.text}</p>
          <p className="text-sm text-stone">
            The ram model at this fall and lift, beating as counted, gives{' '}
            <span className="figure">{showQuantity(check.valve.atMeasuredBeats.deliveryLpm * 1440, 'litresPerDay', units)}</span>; at the design point{' '}
            <span className="figure">{showQuantity(check.valve.atDesign.deliveryLpm * 1440, 'litresPerDay', units)}</span>.
          </p>
        </div>
      )}
      {check.causes.length > 0 && (
        <>
          <h3 className="mt-2 font-bold">Worth checking</h3>
          <ul className="ml-5 list-disc">
            {check.causes.map((c) => (
              <li key={c.code}>{c.text}</li>
            ))}
          </ul>
        </>
      )}
    </>
  );
}
