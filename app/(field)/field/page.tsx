import type { Metadata } from 'next';
import { VisitTable } from '@/components/visit-table';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { listVisits } from '@/lib/server/data/visits';

export const metadata: Metadata = { title: 'My site visits' };

export default async function FieldHome() {
  const user = await requirePageUser(['advisor'], '/field');
  const visits = await listVisits(user, { page: 1, pageSize: 50 });
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-bold text-slate">My site visits</h1>
      <p className="text-lg">{visits.total === 1 ? '1 visit is' : `${visits.total} visits are`} assigned to you.</p>
      <VisitTable visits={visits.items} showAdvisor={false} caption="Visits assigned to you" />
    </div>
  );
}
