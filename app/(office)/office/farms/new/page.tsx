import type { Metadata } from 'next';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { listPeople } from '@/lib/server/data/people';
import { FarmForm } from '../[id]/_components/farm-form';

export const metadata: Metadata = { title: 'Add a farm' };

export default async function NewFarmPage() {
  const user = await requirePageUser(['coordinator'], '/office/farms/new');
  const people = await listPeople(user, { page: 1, pageSize: 100 });
  const farmers = people.items.filter((p) => p.role === 'farmer').map((p) => ({ id: p.id, name: p.name }));
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-bold text-slate">Add a farm</h1>
      <FarmForm farmers={farmers} />
    </div>
  );
}
