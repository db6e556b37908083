'use client';

import { useFieldQuery } from '../../_components/use-field-query';
import Link from 'next/link';
import { Suspense } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { fieldDb } from '@/lib/client/db';
import { formatCount } from '@/lib/shared/display/numbers';
import { POINT_ROLE_WORDS } from '@/lib/shared/reading-words';
import { showQuantity } from '@/lib/shared/display/quantities';
import { SectionHeader } from '../../_components/choice';
import { OfflineMapNote } from '../../_components/offline-map-note';
import { useVisitId } from '../../_components/use-field-data';
import { WithUnits } from '../../_components/with-units';
import type { UnitSystem } from '@/lib/shared/domain';
import { useUndoableDelete } from '../../_components/undo-delete';
import { PointForm } from './_components/point-form';

function PointsPage({ units }: { units: UnitSystem }) {
  const visitId = useVisitId();
  const { remove, bar } = useUndoableDelete();
  const all = useFieldQuery(async () => (await fieldDb().points.where('visitId').equals(visitId).toArray()).filter((p) => !p.deletedAt), [visitId]);
  // Creek-profile stations (booked along the bank) live on the profile page: dozens of them would bury the site points here.
  const isProfileStation = (p: NonNullable<typeof all>[number]) => p.role === 'station' && p.chainageM !== null;
  const points = all?.filter((p) => !isProfileStation(p));
  const profileStations = all?.filter(isProfileStation).length ?? 0;
  const mapPoints = (points ?? []).flatMap((p) =>
    p.lat !== null && p.lon !== null ? [{ id: p.id, lat: p.lat, lon: p.lon, label: p.label, role: p.role }] : [],
  );
  return (
    <div className="space-y-5">
      <SectionHeader visitId={visitId} title="Points" />
      <PointForm visitId={visitId} units={units} points={mapPoints} />
      <OfflineMapNote visitId={visitId} />
      <section aria-labelledby="saved-points" className="space-y-2">
        <h2 id="saved-points" className="text-xl font-bold">
          Saved points
        </h2>
        {points?.length === 0 && <p className="text-stone">None yet.</p>}
        {profileStations > 0 && (
          <p className="text-stone">
            <span className="figure">{formatCount(profileStations, 'creek-profile station')}</span> {profileStations === 1 ? 'is' : 'are'} on{' '}
            <Link href={`/field/visit/positions?id=${visitId}`} className="font-bold text-slate underline">
              Creek profile, best positions
            </Link>
            .
          </p>
        )}
        <Card as="ul" padding="none" className="divide-y divide-rule">
          {points?.map((p) => (
            <li key={p.id} className="flex items-center justify-between px-3 py-2">
              <span>
                <span className="block font-bold">
                  {POINT_ROLE_WORDS[p.role] ?? 'Other point'}
                  {p.label ? ` · ${p.label}` : ''}
                </span>
                <span className="figure block">
                  {p.lat !== null && p.lon !== null ? `${p.lat.toFixed(5)}, ${p.lon.toFixed(5)}` : 'no position'}
                  {p.accuracyM !== null ? ` ± ${showQuantity(p.accuracyM, 'accuracy', units)}` : ''}
                </span>
              </span>
              <Button variant="quiet" size="sm" onClick={() => remove('point', p.id, 'the point')}>
                Delete
              </Button>
            </li>
          ))}
        </Card>
        {bar}
      </section>
    </div>
  );
}

export default function Page() {
  return (
    <Suspense>
      <WithUnits title="Points">{(units) => <PointsPage units={units} />}</WithUnits>
    </Suspense>
  );
}
