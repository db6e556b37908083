'use client';

import L from 'leaflet';
import { Fragment } from 'react';
import { CircleMarker, Marker, Polyline, Tooltip } from 'react-leaflet';
import type { PositionPair } from '@/lib/engine';
import type { PlacedStation } from '@/lib/shared/station-places';
import { FieldMap } from '../../../_components/field-map';
import { PAIR_COLOURS } from './positions-chart';

const INK = '#15191C';
const CREEK = '#184F69';

// Fallbook's own pair symbols: the intake is a ring, the ram a filled square, each carrying the pair's
// number; they stand beside their station (intakes to the left, rams to the right), pair 1 nearest, so
// pairs that share a station do not hide each other.
function pairIcon(kind: 'intake' | 'ram', rank: number, colour: string) {
  const shape =
    kind === 'intake'
      ? `border-radius:50%;background:#FFFFFF;color:${colour};border:4px solid ${colour}`
      : `border-radius:3px;background:${colour};color:#FFFFFF;border:2px solid ${INK}`;
  const shift = 22 + 31 * (rank - 1);
  return L.divIcon({
    className: '',
    html: `<span data-testid="map-pair-${rank}-${kind}" aria-label="Pair ${rank} ${kind}" style="display:flex;width:28px;height:28px;align-items:center;justify-content:center;font:700 15px sans-serif;${shape}">${rank}</span>`,
    iconSize: [28, 28],
    iconAnchor: kind === 'intake' ? [14 + shift, 14] : [14 - shift, 14],
  });
}

const tankIcon = L.divIcon({
  className: '',
  html: `<span style="display:flex;width:26px;height:26px;align-items:center;justify-content:center;font:700 13px sans-serif;border:3px solid ${INK};background:#F6F4EE;color:${INK}">T</span>`,
  iconSize: [26, 26],
  iconAnchor: [13, 13],
});

/** The creek stations on the map, the tank, and the ranked pairs as numbered intake → ram runs along the bank. */
export default function PositionsMap({ placed, tank, pairs }: { placed: PlacedStation[]; tank: { lat: number; lon: number } | null; pairs: PositionPair[] }) {
  const all: [number, number][] = [...placed.map((s) => [s.lat, s.lon] as [number, number]), ...(tank ? [[tank.lat, tank.lon] as [number, number]] : [])];
  const byId = new Map(placed.map((s) => [s.id, s]));
  const pairPoints = pairs
    .flatMap((p) => [byId.get(p.intake.id), byId.get(p.pump.id)])
    .filter((s): s is PlacedStation => !!s)
    .map((s) => [s.lat, s.lon] as [number, number]);
  return (
    // Fitted to the whole reach, then to the ranked pairs once found; wide side margins for the pair symbols beside their stations.
    <FieldMap places={pairPoints.length > 0 ? pairPoints : all} padding={[115, 30]} maxZoom={19} label="Map of the creek stations and the best pairs">
      <Polyline positions={placed.map((s) => [s.lat, s.lon] as [number, number])} className="map-creek" pathOptions={{ color: CREEK, weight: 3 }} />
      {placed.map((s) => (
        <CircleMarker
          key={s.id}
          center={[s.lat, s.lon]}
          radius={4}
          pathOptions={
            s.placed === 'fix'
              ? { color: INK, fillColor: INK, fillOpacity: 1, weight: 1 }
              : { color: INK, fillColor: '#FFFFFF', fillOpacity: 1, weight: 2, dashArray: '2 2' }
          }
        >
          <Tooltip>{`${s.chainageM} m along the bank${s.placed === 'chainage' ? ' (placed by chainage)' : ''}`}</Tooltip>
        </CircleMarker>
      ))}
      {tank && (
        <Marker position={[tank.lat, tank.lon]} icon={tankIcon}>
          <Tooltip>Tank</Tooltip>
        </Marker>
      )}
      {/* Drawn 3, 2, 1 so the best pair lies on top where runs overlap. */}
      {pairs
        .map((p, i) => ({ p, i }))
        .reverse()
        .map(({ p, i }) => {
          const intake = byId.get(p.intake.id);
          const ram = byId.get(p.pump.id);
          if (!intake || !ram) return null;
          const colour = PAIR_COLOURS[i] ?? '#4F555A';
          const [lo, hi] = [Math.min(intake.chainageM, ram.chainageM), Math.max(intake.chainageM, ram.chainageM)];
          const run = placed.filter((s) => s.chainageM >= lo && s.chainageM <= hi).map((s) => [s.lat, s.lon] as [number, number]);
          return (
            <Fragment key={`${p.intake.id}-${p.pump.id}`}>
              <Polyline positions={run} className={`map-pair-line-${p.rank}`} pathOptions={{ color: colour, weight: 8, opacity: 0.75, lineCap: 'round' }} />
              <Marker position={[intake.lat, intake.lon]} icon={pairIcon('intake', p.rank, colour)}>
                <Tooltip>{`Pair ${p.rank}: intake at ${p.intake.chainageM} m`}</Tooltip>
              </Marker>
              <Marker position={[ram.lat, ram.lon]} icon={pairIcon('ram', p.rank, colour)}>
                <Tooltip>{`Pair ${p.rank}: ram at ${p.pump.chainageM} m`}</Tooltip>
              </Marker>
              {(() => {
                const stand = p.standPipe ? byId.get(p.standPipe.id) : undefined;
                return stand ? (
                  <CircleMarker
                    center={[stand.lat, stand.lon]}
                    radius={7}
                    className={`map-pair-${p.rank}-stand-pipe`}
                    pathOptions={{ color: colour, fillColor: '#FFFFFF', fillOpacity: 1, weight: 4 }}
                  >
                    <Tooltip>{`Pair ${p.rank}: stand pipe at ${stand.chainageM} m (feed pipe above it, drive pipe below)`}</Tooltip>
                  </CircleMarker>
                ) : null;
              })()}
            </Fragment>
          );
        })}
    </FieldMap>
  );
}
