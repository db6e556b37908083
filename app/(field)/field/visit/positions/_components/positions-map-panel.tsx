'use client';

import dynamic from 'next/dynamic';
import { Card } from '@/components/ui/card';
import type { PositionPair } from '@/lib/engine';
import type { LocalRecord } from '@/lib/client/db';
import type { LocalProfile } from '@/lib/client/profile-positions';
import { placeStations } from '@/lib/shared/station-places';

const PositionsMap = dynamic(() => import('./positions-map'), { ssr: false, loading: () => <p className="text-stone">Loading the map…</p> });

/**
 * The map beside the profile chart: stations where the phone fixed them (or placed by chainage
 * between fixes), the tank, and the ranked pairs numbered as on the chart. Says what it could not place.
 */
export function PositionsMapPanel({
  stations,
  tankPoint,
  pairs,
}: {
  stations: LocalProfile['stations'];
  tankPoint: LocalRecord<'point'> | null;
  pairs: PositionPair[];
}) {
  const { placed, unplaced } = placeStations(stations.map((s) => ({ id: s.id, chainageM: s.chainageM, lat: s.point.lat, lon: s.point.lon })));
  if (placed.length < 2) {
    return (
      <Card as="p" tone="field" padding="md" className="text-stone" data-testid="map-note">
        No map yet: fewer than two stations have a position. Stations booked with the phone&rsquo;s location on appear here.
      </Card>
    );
  }
  const byChainage = placed.filter((s) => s.placed === 'chainage').length;
  const placedIds = new Set(placed.map((s) => s.id));
  const offMap = pairs.filter((p) => !placedIds.has(p.intake.id) || !placedIds.has(p.pump.id)).map((p) => p.rank);
  const tank = tankPoint?.lat != null && tankPoint.lon != null ? { lat: tankPoint.lat, lon: tankPoint.lon } : null;
  return (
    <figure className="space-y-2">
      <PositionsMap placed={placed} tank={tank} pairs={pairs} />
      <figcaption className="text-stone" data-testid="map-note">
        Rings are intakes, filled squares rams, numbered as on the chart; the thick line runs along the bank from intake to ram; T is the tank.
        {pairs.length > 0 && ' Zoomed to the pairs: zoom out for the whole reach.'}
        {byChainage > 0 && (
          <>
            {' '}
            <span className="figure">{byChainage}</span> {byChainage === 1 ? 'station has' : 'stations have'} no fix of their own: placed by chainage between
            the nearest fixed stations (hollow dots).
          </>
        )}
        {unplaced.length > 0 && (
          <>
            {' '}
            <span className="figure">{unplaced.length}</span> left off the map: no fixed station on both sides.
          </>
        )}
        {offMap.length > 0 && <> Pair {offMap.join(', ')} not drawn: a station of it is off the map.</>}
      </figcaption>
    </figure>
  );
}
