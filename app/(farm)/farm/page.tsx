import type { Metadata } from 'next';
import { Card } from '@/components/ui/card';
import { TapLink } from '@/components/ui/tap-link';
import { VerdictMark } from '@/components/verdict-mark';
import { VisitTable } from '@/components/visit-table';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { listFarms } from '@/lib/server/data/farms';
import { listVisits } from '@/lib/server/data/visits';
import { showQuantity } from '@/lib/shared/display/quantities';

export const metadata: Metadata = { title: 'My farm' };

export default async function FarmHome() {
  const user = await requirePageUser(['farmer'], '/farm');
  const [farms, visits] = await Promise.all([listFarms(user, { page: 1, pageSize: 20 }), listVisits(user, { page: 1, pageSize: 20 })]);
  return (
    <div className="space-y-8">
      <h1 className="text-3xl font-bold text-slate">My farm</h1>
      <section aria-labelledby="farms" className="space-y-3">
        <h2 id="farms" className="text-xl font-bold">
          Farms and water needs
        </h2>
        {farms.items.length === 0 && <p className="text-lg text-stone">No farm is registered to you yet.</p>}
        <ul className="space-y-2">
          {farms.items.map((farm) => (
            <Card as="li" key={farm.id}>
              <span className="block text-lg font-bold">{farm.name}</span>
              <span className="block text-stone">{farm.area}</span>
              <span className="mt-1 block">
                Daily need you told us: <strong className="figure">{showQuantity(farm.demandLpd, 'litresPerDay', user.units)}</strong>
              </span>
              <TapLink href={`/farm/farms/${farm.id}/needs`} className="mt-2">
                Water needs for {farm.name}
              </TapLink>
            </Card>
          ))}
        </ul>
      </section>
      {visits.items.some((v) => v.verdict) && (
        <section aria-labelledby="sheets" className="space-y-3">
          <h2 id="sheets" className="text-xl font-bold">
            Your sheets
          </h2>
          <ul className="space-y-2">
            {visits.items
              .filter((v) => v.verdict)
              .map((v) => (
                <Card as="li" key={v.id} className="flex flex-wrap items-center justify-between gap-3">
                  <span>
                    <span className="block text-lg font-bold">{v.farm.name}</span>
                    {v.verdict && <VerdictMark verdict={v.verdict} size={20} />}
                  </span>
                  <TapLink href={`/sheets/${v.id}`}>Read the sheet for {v.farm.name}</TapLink>
                </Card>
              ))}
          </ul>
        </section>
      )}
      <section aria-labelledby="visits">
        <h2 id="visits" className="mb-3 text-xl font-bold">
          Site visits
        </h2>
        <VisitTable visits={visits.items} caption="Visits to your farms" />
      </section>
    </div>
  );
}
