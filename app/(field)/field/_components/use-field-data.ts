'use client';

import { useSearchParams } from 'next/navigation';
import type { UnitSystem } from '@/lib/shared/domain';
import { useFieldUser } from './field-session';
import { useFieldQuery } from './use-field-query';

/** The visit id from `?id=`: field routes carry ids in the query so they are static and open offline. */
export function useVisitId(): string {
  return useSearchParams().get('id') ?? '';
}

/** The visit and its farm from the phone's database (undefined while loading, null if absent). */
export function useVisit(id: string) {
  return useFieldQuery('visitWithFarm', id);
}

/**
 * The reader's unit system: the field frame's person's (remembered on the phone, then confirmed by
 * the server), or undefined until the frame knows who it is. A screen holds its fields until then,
 * so nothing is typed against labels in the wrong units.
 */
export function useUnits(): UnitSystem | undefined {
  return useFieldUser()?.units;
}
