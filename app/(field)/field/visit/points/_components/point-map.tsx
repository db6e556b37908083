'use client';

import L from 'leaflet';
import { Marker, Polyline, Tooltip } from 'react-leaflet';
import { FieldMap, type Place } from '../../../_components/field-map';
import { useVisit, useVisitId } from '../../../_components/use-field-data';

export interface MapPoint {
  id: string;
  lat: number;
  lon: number;
  label: string;
  role: string;
}

// Our own markers (no bundled image icons): a ring with the role's first letter.
const icon = (role: string, draft = false) =>
  L.divIcon({
    className: '',
    html: `<span data-testid="${draft ? 'map-draft' : 'map-point'}" style="display:flex;width:34px;height:34px;border-radius:50%;align-items:center;justify-content:center;font:700 15px sans-serif;border:3px solid #15191C;background:${draft ? '#F6F4EE' : '#FFFFFF'};color:#15191C">${role.slice(0, 1).toUpperCase()}</span>`,
    iconSize: [34, 34],
    iconAnchor: [17, 17],
  });

/**
 * Points and the route between them, fitted to the saved points (or the farm before there are any);
 * the pin being placed (a fix taken, typed coordinates) is kept in view. Works with no tiles at all.
 */
export default function PointMap({
  points,
  draft,
  onDraftMove,
}: {
  points: MapPoint[];
  draft: { lat: number; lon: number } | null;
  onDraftMove: (lat: number, lon: number) => void;
}) {
  const farm = useVisit(useVisitId())?.farm;
  const home: Place | null = farm?.lat != null && farm.lon != null ? [farm.lat, farm.lon] : null;
  const places = points.map((p) => [p.lat, p.lon] as Place);
  const follow: Place | null = draft ? [draft.lat, draft.lon] : null;
  return (
    <FieldMap places={places} home={home} follow={follow} label="Map of the visit's points">
      {points.length > 1 && <Polyline positions={places} pathOptions={{ color: '#184F69', weight: 4 }} />}
      {points.map((p) => (
        <Marker key={p.id} position={[p.lat, p.lon]} icon={icon(p.role)}>
          <Tooltip>{p.label || p.role}</Tooltip>
        </Marker>
      ))}
      {draft && (
        <Marker
          position={[draft.lat, draft.lon]}
          icon={icon('+', true)}
          draggable
          eventHandlers={{
            dragend: (e) => {
              const ll = (e.target as L.Marker).getLatLng();
              onDraftMove(ll.lat, ll.lng);
            },
          }}
        >
          <Tooltip permanent>Drag to the spot</Tooltip>
        </Marker>
      )}
    </FieldMap>
  );
}
