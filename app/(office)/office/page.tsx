import type { Metadata } from 'next';
import { VisitTable } from '@/components/visit-table';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { listPeople } from '@/lib/server/data/people';
import { listVisits, visitCounts } from '@/lib/server/data/visits';
import { VISIT_STATUS_LABELS, VISIT_STATUSES } from '@/lib/shared/domain';

export const metadata: Metadata = { title: 'District office' };

export default async function OfficeHome() {
  const user = await requirePageUser(['coordinator'], '/office');
  const [counts, visits, people] = await Promise.all([
    visitCounts(user),
    listVisits(user, { page: 1, pageSize: 25 }),
    listPeople(user, { page: 1, pageSize: 100 }),
  ]);
  const advisors = people.items.filter((p) => p.role === 'advisor' && p.active);
  return (
    <div className="space-y-8">
      <section>
        <h1 className="text-3xl font-bold text-slate">District office</h1>
        <p className="mt-1 text-lg">
          {visits.total} visits · {advisors.length} active advisors
          {counts.overdue > 0 && <strong className="text-clay"> · {counts.overdue} overdue</strong>}
        </p>
      </section>
      <section aria-labelledby="board">
        <h2 id="board" className="text-xl font-bold">Where every farm stands</h2>
        <ul className="mt-3 grid grid-cols-2 gap-2 sm:grid-cols-4">
          {VISIT_STATUSES.filter((s) => s !== 'cancelled').map((status) => (
            <li key={status} className="rounded-md border border-rule bg-white p-3">
              <span className="figure block text-2xl font-semibold">{counts.byStatus[status] ?? 0}</span>
              <span className="block text-stone">{VISIT_STATUS_LABELS[status]}</span>
            </li>
          ))}
        </ul>
      </section>
      <section aria-labelledby="visits">
        <h2 id="visits" className="mb-3 text-xl font-bold">Visits</h2>
        <VisitTable visits={visits.items} caption="Visits in the district" />
      </section>
    </div>
  );
}
