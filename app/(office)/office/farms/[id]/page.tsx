import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { getFarmForEdit } from '@/lib/server/data/farm-editing';
import { listPeople } from '@/lib/server/data/people';
import { idParam } from '@/lib/shared/schemas/list-query';
import { FarmForm } from './_components/farm-form';

export const metadata: Metadata = { title: 'Edit farm' };

export default async function EditFarmPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePageUser(['coordinator'], `/office/farms/${id}`);
  if (!idParam.safeParse({ id }).success) notFound();
  const farm = await getFarmForEdit(user, id).catch(() => null);
  if (!farm) notFound();
  const people = await listPeople(user, { page: 1, pageSize: 100 });
  const farmers = people.items.filter((p) => p.role === 'farmer').map((p) => ({ id: p.id, name: p.name }));
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-bold text-slate">{farm.name}</h1>
      <FarmForm farm={farm} farmers={farmers} />
    </div>
  );
}
