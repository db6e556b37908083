import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { StatusChip } from '@/components/status-chip';
import { ButtonLink } from '@/components/ui/button';
import { VerdictMark } from '@/components/verdict-mark';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { getFarmForEdit } from '@/lib/server/data/farm-editing';
import { getFarmNeeds } from '@/lib/server/data/farm-needs';
import { farmVisitSummaries } from '@/lib/server/data/farm-visits';
import { listPeople } from '@/lib/server/data/people';
import { formatDay } from '@/lib/shared/display/dates';
import { formatWhole } from '@/lib/shared/display/numbers';
import { showQuantity } from '@/lib/shared/display/quantities';
import { idParam } from '@/lib/shared/schemas/list-query';
import { ACTIVE_STATUSES } from '@/lib/shared/visit-states';
import { FarmForm } from './_components/farm-form';

export const metadata: Metadata = { title: 'Farm' };

/** A farm as the office follows it: its visits, what it needs, its sheets, "Plan a visit", and its details to edit. */
export default async function FarmPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePageUser(['coordinator'], `/office/farms/${id}`);
  if (!idParam.safeParse({ id }).success) notFound();
  const farm = await getFarmForEdit(user, id).catch(() => null);
  if (!farm) notFound();
  const [people, needs, visits] = await Promise.all([listPeople(user, { page: 1, pageSize: 100 }), getFarmNeeds(user, id), farmVisitSummaries(user, id)]);
  const farmers = people.items.filter((p) => p.role === 'farmer').map((p) => ({ id: p.id, name: p.name }));
  const dailyNeed = needs.lines.reduce((sum, l) => sum + l.count * l.litresPerHeadPerDay, 0);
  const active = visits.filter((v) => ACTIVE_STATUSES.includes(v.status));
  const sheets = visits.filter((v) => v.verdict);
  return (
    <div className="space-y-8">
      <p>
        <Link href="/office/farms">← All farms</Link>
      </p>
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 className="text-3xl font-bold text-slate">{farm.name}</h1>
          <p className="text-lg text-stone">
            {farm.area || 'No area given'}
            {needs.tankSite ? ` · tank: ${needs.tankSite}` : ''}
          </p>
        </div>
        <ButtonLink href={`/office/visits/new?farm=${id}`}>Plan a visit</ButtonLink>
      </div>
      {active.length > 0 && (
        <p className="font-bold text-ochre">{active.length === 1 ? 'One visit is' : `${active.length} visits are`} under way for this farm.</p>
      )}

      <section aria-labelledby="farm-visits" className="space-y-3">
        <h2 id="farm-visits" className="text-xl font-bold">
          Visits
        </h2>
        {visits.length === 0 ? (
          <p className="text-stone">No visit yet.</p>
        ) : (
          <ul className="divide-y divide-rule border-y border-rule" aria-label="Visits to this farm">
            {visits.map((v) => (
              <li key={v.id} className="flex flex-wrap items-center justify-between gap-3 py-3">
                <span>
                  <Link href={`/office/visits/${v.id}`} className="font-bold">
                    {v.plannedOn ? formatDay(v.plannedOn) : 'No date yet'}
                  </Link>
                  <span className="block text-stone">
                    {v.advisor?.name ?? 'No advisor yet'}
                    {v.overdue && <strong className="ml-2 text-clay">⚠ Overdue</strong>}
                  </span>
                </span>
                <StatusChip status={v.status} />
              </li>
            ))}
          </ul>
        )}
      </section>

      <section aria-labelledby="farm-needs" className="space-y-3">
        <h2 id="farm-needs" className="text-xl font-bold">
          Water needed
        </h2>
        {needs.lines.length === 0 ? (
          <p className="text-stone">Nothing entered yet by the farmer or an advisor.</p>
        ) : (
          <>
            <ul className="space-y-1" aria-label="Water needs">
              {needs.lines.map((l) => (
                <li key={l.id}>
                  <span className="figure">{formatWhole(l.count)}</span> × {l.label}{' '}
                  <span className="figure text-stone">({showQuantity(l.litresPerHeadPerDay, 'litresPerHead', user.units)} each)</span>
                </li>
              ))}
            </ul>
            <p>
              In all about <strong className="figure">{showQuantity(dailyNeed, 'litresPerDay', user.units)}</strong>.
            </p>
          </>
        )}
      </section>

      <section aria-labelledby="farm-sheets" className="space-y-3">
        <h2 id="farm-sheets" className="text-xl font-bold">
          Sheets
        </h2>
        {sheets.length === 0 ? (
          <p className="text-stone">No visit has been screened yet.</p>
        ) : (
          <ul className="space-y-2">
            {sheets.map((v) => (
              <li key={v.id} className="flex flex-wrap items-center gap-3">
                {v.verdict && <VerdictMark verdict={v.verdict} size={18} />}
                <Link href={`/sheets/${v.id}`} className="font-bold">
                  Sheet of the visit {v.plannedOn ? `of ${formatDay(v.plannedOn)}` : 'without a date'}
                </Link>
                <span className="text-stone">{v.statusLabel}</span>
              </li>
            ))}
          </ul>
        )}
      </section>

      <section aria-labelledby="farm-details" className="space-y-3">
        <h2 id="farm-details" className="text-xl font-bold">
          Farm details
        </h2>
        <FarmForm farm={farm} farmers={farmers} />
      </section>
    </div>
  );
}
