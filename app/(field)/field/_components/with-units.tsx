'use client';

import type { ReactNode } from 'react';
import type { UnitSystem } from '@/lib/shared/domain';
import { SectionHeader } from './choice';
import { useUnits, useVisitId } from './use-field-data';

/**
 * A capture screen once the reader's units are known: its fields are labelled and read in them.
 * Until then (the field frame is still asking who is signed in) its heading and a note.
 */
export function WithUnits({ title, children }: { title: string; children: (units: UnitSystem) => ReactNode }) {
  const units = useUnits();
  const visitId = useVisitId();
  if (units === undefined) {
    return (
      <div className="space-y-5">
        <SectionHeader visitId={visitId} title={title} />
        <p className="text-lg">Reading the phone…</p>
      </div>
    );
  }
  return children(units);
}
