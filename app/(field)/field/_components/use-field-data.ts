'use client';

import { useFieldQuery } from './use-field-query';
import { useSearchParams } from 'next/navigation';
import { fieldDb } from '@/lib/client/db';
import { getMeta } from '@/lib/client/sync/meta';
import type { SessionUser, UnitSystem } from '@/lib/shared/domain';

/** The visit id from `?id=`: field routes carry ids in the query so they are static and open offline. */
export function useVisitId(): string {
  return useSearchParams().get('id') ?? '';
}

/** The visit and its farm from the phone's database (undefined while loading, null if absent). */
export function useVisit(id: string) {
  return useFieldQuery(async () => {
    const visit = await fieldDb().visits.get(id);
    if (!visit) return null;
    const farm = await fieldDb().farms.get(visit.farmId);
    return { visit, farm: farm ?? null };
  }, [id]);
}

/** The reader's unit system (remembered user's preference). */
export function useUnits(): UnitSystem {
  return useFieldQuery(async () => (await getMeta<SessionUser>('user'))?.units ?? 'metric', [], 'metric');
}
