import type { Metadata } from 'next';
import Link from 'next/link';
import { StatusChip } from '@/components/status-chip';
import { VerdictMark } from '@/components/verdict-mark';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { visitAuditTrail } from '@/lib/server/data/audit-trail';
import { listPeople } from '@/lib/server/data/people';
import { screeningBlockers } from '@/lib/server/services/screening';
import { getVisitOrThrow } from '@/lib/server/data/visits';
import { formatDateTime, formatDay } from '@/lib/shared/display/dates';
import { idParam } from '@/lib/shared/schemas/list-query';
import { mayHoldUnsyncedData } from '@/lib/shared/visit-rules';
import { notFound } from 'next/navigation';
import { AssignForm } from './_components/assign-form';
import { AuditHistory } from './_components/audit-history';
import { StatusForm } from './_components/status-form';

export const metadata: Metadata = { title: 'Visit' };

export default async function OfficeVisitPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePageUser(['coordinator'], `/office/visits/${id}`);
  if (!idParam.safeParse({ id }).success) notFound();
  const visit = await getVisitOrThrow(user, id, 'visit:plan').catch((e: { status?: number }) =>
    e.status === 404 || e.status === 403 ? null : Promise.reject(e),
  );
  if (!visit) notFound();
  const [audit, people, blockers] = await Promise.all([
    visitAuditTrail(user, id),
    listPeople(user, { page: 1, pageSize: 100 }),
    visit.verdict ? Promise.resolve([]) : screeningBlockers(id),
  ]);
  const advisors = people.items.filter((p) => p.role === 'advisor' && (p.active || p.id === visit.advisor?.id)).map((p) => ({ id: p.id, name: p.name }));
  const names = new Map(people.items.map((p) => [p.id, p.name]));
  const unsynced = mayHoldUnsyncedData({ ...visit, advisorId: visit.advisor?.id ?? null });
  return (
    <div className="space-y-8">
      <p>
        <Link href="/office">← All visits</Link>
      </p>
      <section>
        <h1 className="text-3xl font-bold text-slate">{visit.farm.name}</h1>
        <p className="text-lg text-stone">
          {visit.farm.area}
          {visit.farmer ? ` · farmer ${visit.farmer.name}` : ''} · <Link href={`/office/farms/${visit.farm.id}`}>The farm’s page</Link>
        </p>
        <dl className="mt-4 grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-4">
          <div>
            <dt className="text-stone">State</dt>
            <dd>
              <StatusChip status={visit.status} />
            </dd>
          </div>
          <div>
            <dt className="text-stone">Advisor</dt>
            <dd className="font-bold">{visit.advisor?.name ?? 'Not assigned'}</dd>
          </div>
          <div>
            <dt className="text-stone">Planned</dt>
            <dd className="figure">
              {formatDay(visit.plannedOn)}
              {visit.overdue && <strong className="ml-2 text-clay">⚠ Overdue</strong>}
            </dd>
          </div>
          <div>
            <dt className="text-stone">Screening</dt>
            <dd>
              {visit.verdict ? (
                <>
                  <VerdictMark verdict={visit.verdict} size={18} />{' '}
                  <Link href={`/sheets/${visit.id}`} className="ml-2 font-bold">
                    Open the sheet
                  </Link>
                </>
              ) : (
                'Not screened'
              )}
            </dd>
          </div>
          <div>
            <dt className="text-stone">Last synced</dt>
            <dd className="figure">{visit.lastSyncedAt ? formatDateTime(visit.lastSyncedAt) : 'Never'}</dd>
          </div>
        </dl>
        {blockers.length > 0 && (
          <div className="mt-3 max-w-prose">
            <p className="font-bold">The screen cannot run yet:</p>
            <ul className="list-disc pl-6">
              {blockers.slice(0, 8).map((b) => (
                <li key={b}>{b}</li>
              ))}
            </ul>
          </div>
        )}
        {visit.notes && <p className="mt-3 max-w-prose">{visit.notes}</p>}
      </section>
      <section aria-labelledby="assign" className="space-y-3">
        <h2 id="assign" className="text-xl font-bold">
          Advisor and date
        </h2>
        <AssignForm
          visitId={visit.id}
          advisors={advisors}
          current={{ advisorId: visit.advisor?.id ?? null, plannedOn: visit.plannedOn }}
          mayBeUnsynced={unsynced}
        />
      </section>
      <section aria-labelledby="state" className="space-y-3">
        <h2 id="state" className="text-xl font-bold">
          Follow-up
        </h2>
        <StatusForm key={visit.status} visitId={visit.id} status={visit.status} />
      </section>
      <section aria-labelledby="history" className="space-y-3">
        <h2 id="history" className="text-xl font-bold">
          Who changed what
        </h2>
        <AuditHistory lines={audit} names={names} />
      </section>
    </div>
  );
}
