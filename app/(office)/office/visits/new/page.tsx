import type { Metadata } from 'next';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { listFarms } from '@/lib/server/data/farms';
import { listPeople } from '@/lib/server/data/people';
import { NewVisitForm } from './_components/new-visit-form';

export const metadata: Metadata = { title: 'Plan a visit' };

export default async function NewVisitPage({ searchParams }: { searchParams: Promise<{ farm?: string }> }) {
  const user = await requirePageUser(['coordinator'], '/office/visits/new');
  const { farm } = await searchParams;
  const [farms, people] = await Promise.all([listFarms(user, { page: 1, pageSize: 100 }), listPeople(user, { page: 1, pageSize: 100 })]);
  const advisors = people.items.filter((p) => p.role === 'advisor' && p.active).map((p) => ({ id: p.id, name: p.name }));
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-bold text-slate">Plan a visit</h1>
      <NewVisitForm farms={farms.items.map((f) => ({ id: f.id, name: f.name }))} advisors={advisors} farmId={farm} />
    </div>
  );
}
