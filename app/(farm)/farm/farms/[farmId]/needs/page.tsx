import type { Metadata } from 'next';
import Link from 'next/link';
import { forbidden, notFound } from 'next/navigation';
import { DEMAND_CATALOGUE } from '@/lib/engine/demand';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { getFarmNeeds } from '@/lib/server/data/farm-needs';
import { AppError } from '@/lib/server/errors';
import { idParam } from '@/lib/shared/schemas/list-query';
import { ANIMAL_KINDS } from '@/lib/shared/schemas/sheet';
import { m2ToFt2 } from '@/lib/shared/units';
import { NeedsForm } from './_components/needs-form';

export const metadata: Metadata = { title: 'Your water needs' };

export default async function FarmNeedsPage({ params }: { params: Promise<{ farmId: string }> }) {
  const { farmId } = await params;
  const user = await requirePageUser(['farmer'], `/farm/farms/${farmId}/needs`);
  if (!idParam.safeParse({ id: farmId }).success) notFound();
  const needs = await getFarmNeeds(user, farmId).catch((error: unknown) => {
    if (error instanceof AppError && error.status === 403) forbidden();
    if (error instanceof AppError && error.status === 404) notFound();
    throw error;
  });
  const us = user.units === 'us';
  const garden = us ? Math.round(m2ToFt2(needs.gardenM2)) : needs.gardenM2;
  return (
    <div className="max-w-xl space-y-6">
      <p>
        <Link href="/farm">← My farm</Link>
      </p>
      <h1 className="text-3xl font-bold text-slate">Water needs: {needs.farmName}</h1>
      <p className="text-lg">
        Tell us who and what needs water every day. Your advisor starts from these numbers when they visit, and can change them with you.
      </p>
      <NeedsForm
        farmId={farmId}
        units={user.units}
        animalKinds={ANIMAL_KINDS.map((kind) => ({ kind, label: DEMAND_CATALOGUE[kind].label }))}
        initial={{
          people: String(needs.people),
          animals: needs.animals.map((a) => ({ kind: a.kind, count: String(a.count) })),
          gardenArea: String(garden),
          gardenUnit: us ? 'ft2' : 'm2',
          tankSite: needs.tankSite,
        }}
      />
    </div>
  );
}
