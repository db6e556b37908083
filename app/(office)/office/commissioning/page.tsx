import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { listCommissionings } from '@/lib/server/data/commissioning';
import { formatPercent } from '@/lib/shared/display/numbers';
import { showQuantity } from '@/lib/shared/display/quantities';
import { PredictedMeasuredPlot } from './_components/PredictedMeasuredPlot';

export const metadata: Metadata = { title: 'Installed rams: predicted and measured' };

const OUTCOME_WORDS: Record<string, string> = {
  'as-predicted': 'Within the predicted range',
  'above-band': 'Above the predicted range',
  short: 'Short of the predicted range',
  'well-short': 'Well short (under half)',
};

export default async function CommissioningPage() {
  const user = await requirePageUser(['coordinator'], '/office/commissioning');
  const points = await listCommissionings(user);
  return (
    <div className="space-y-4">
      <h1 className="text-3xl font-bold text-slate">Installed rams: predicted and measured</h1>
      <p className="max-w-3xl text-stone">
        Each mark is a commissioned ram: across, what its screening predicted; up, what the bucket at the tank measured. The grey bar is the screening&rsquo;s
        10–90 % range. Green circles sit in or above the range; red triangles fell short of it.
      </p>
      {points.length === 0 ? (
        <p>No ram has been commissioned yet. The advisor records the check on the visit once the ram runs.</p>
      ) : (
        <>
          <PredictedMeasuredPlot points={points} units={user.units} />
          <div className="overflow-x-auto">
            <table className="w-full max-w-4xl text-left [&_td]:px-2 [&_th]:px-2">
              <thead>
                <tr className="border-b border-rule">
                  <th className="py-2">Farm</th>
                  <th>Predicted</th>
                  <th>Measured</th>
                  <th>Ram efficiency (D&rsquo;Aubuisson)</th>
                  <th>Outcome</th>
                </tr>
              </thead>
              <tbody className="divide-y divide-rule">
                {points.map((p) => (
                  <tr key={p.id}>
                    <td className="py-2">
                      <Link href={`/office/visits/${p.visitId}`}>{p.farmName}</Link>
                    </td>
                    <td className="font-mono">{showQuantity(p.predictedLpd, 'litresPerDay', user.units)}</td>
                    <td className="font-mono">{showQuantity(p.measuredLpd, 'litresPerDay', user.units)}</td>
                    <td className="font-mono">{formatPercent(p.daubuissonEfficiency)}</td>
                    <td>{p.outcome ? (OUTCOME_WORDS[p.outcome] ?? p.outcome) : 'No prediction to compare'}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </>
      )}
      <p className="max-w-3xl text-sm text-stone">
        A screening is not an engineering design. Surge pressure can burst pipes and fittings: installation and repairs follow local codes and licensed
        practice.
      </p>
    </div>
  );
}
