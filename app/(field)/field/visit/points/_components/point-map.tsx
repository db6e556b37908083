'use client';

import L from 'leaflet';
import { Marker, Polyline, Tooltip } from 'react-leaflet';
import { FieldMap } from '../../../_components/field-map';

export interface MapPoint { id: string; lat: number; lon: number; label: string; role: string }

// Our own markers (no bundled image icons): a ring with the role's first letter.
const icon = (role: string, draft = false) => L.divIcon({
  className: '',
  html: `<span style="display:flex;width:34px;height:34px;border-radius:50%;align-items:center;justify-content:center;font:700 15px sans-serif;border:3px solid #15191C;background:${draft ? '#F6F4EE' : '#FFFFFF'};color:#15191C">${role.slice(0, 1).toUpperCase()}</span>`,
  iconSize: [34, 34],
  iconAnchor: [17, 17],
});

/** Points and the route between them; works with no tiles at all (lines, markers and a scale). */
export default function PointMap({ points, draft, onDraftMove }: {
  points: MapPoint[];
  draft: { lat: number; lon: number } | null;
  onDraftMove: (lat: number, lon: number) => void;
}) {
  const all = [...points.map((p) => [p.lat, p.lon] as [number, number]), ...(draft ? [[draft.lat, draft.lon] as [number, number]] : [])];
  const center = all[0] ?? [0, 0];
  return (
    <FieldMap center={center} zoom={all.length ? 16 : 2} bounds={all.length > 1 ? L.latLngBounds(all) : undefined}>
      {points.length > 1 && <Polyline positions={points.map((p) => [p.lat, p.lon] as [number, number])} pathOptions={{ color: '#184F69', weight: 4 }} />}
      {points.map((p) => (
        <Marker key={p.id} position={[p.lat, p.lon]} icon={icon(p.role)}>
          <Tooltip>{p.label || p.role}</Tooltip>
        </Marker>
      ))}
      {draft && (
        <Marker position={[draft.lat, draft.lon]} icon={icon('+', true)} draggable
          eventHandlers={{ dragend: (e) => { const ll = (e.target as L.Marker).getLatLng(); onDraftMove(ll.lat, ll.lng); } }}>
          <Tooltip permanent>Drag to the spot</Tooltip>
        </Marker>
      )}
    </FieldMap>
  );
}
