'use client';

import 'leaflet/dist/leaflet.css';
import L from 'leaflet';
import { useMemo } from 'react';
import { MapContainer, Marker, Popup, ScaleControl, TileLayer } from 'react-leaflet';
import { verdictSvg, VERDICT_WORDS } from '@/components/verdict-svg';
import type { Verdict } from '@/lib/shared/domain';

export interface MapSiteView {
  visitId: string;
  farmName: string;
  statusLabel: string;
  verdict: Verdict | null;
  points: { role: string; lat: number; lon: number }[];
}

const ROLE_WORDS: Record<string, string> = { intake: 'intake', pump: 'pump site', tank: 'tank', station: 'station', source: 'source', other: 'point', farm: 'farm (no site points yet)' };

/** The district's sites on a Leaflet map: each point a verdict vial; tiles only if NEXT_PUBLIC_TILE_URL is set. */
export default function DistrictMapView({ sites }: { sites: MapSiteView[] }) {
  const tileUrl = process.env.NEXT_PUBLIC_TILE_URL;
  const icons = useMemo(() => {
    const make = (v: Verdict | 'none') => L.divIcon({ html: verdictSvg(v, 40), className: 'fallbook-marker', iconSize: [40, 24], iconAnchor: [20, 12] });
    return { go: make('go'), conditional: make('conditional'), 'no-go': make('no-go'), gravity: make('gravity'), none: make('none') };
  }, []);
  const all = sites.flatMap((s) => s.points.map((p) => [p.lat, p.lon] as [number, number]));
  const bounds = all.length ? L.latLngBounds(all).pad(0.2) : undefined;
  return (
    <MapContainer bounds={bounds} center={bounds ? undefined : [52.4, -3.6]} zoom={bounds ? undefined : 11} scrollWheelZoom
      style={{ height: '60vh', minHeight: 360, background: '#EDEAE0' }} aria-label="Map of the district's sites">
      {tileUrl && <TileLayer url={tileUrl} attribution={process.env.NEXT_PUBLIC_TILE_ATTRIBUTION ?? ''} />}
      <ScaleControl position="bottomleft" />
      {sites.flatMap((s) => s.points.map((p, i) => (
        <Marker key={`${s.visitId}-${i}`} position={[p.lat, p.lon]} icon={icons[s.verdict ?? 'none']} title={`${s.farmName}: ${VERDICT_WORDS[s.verdict ?? 'none']}, ${ROLE_WORDS[p.role] ?? p.role}`}>
          <Popup>
            <strong>{s.farmName}</strong><br />
            {VERDICT_WORDS[s.verdict ?? 'none']} · {s.statusLabel}<br />
            {ROLE_WORDS[p.role] ?? p.role}<br />
            <a href={`/office/visits/${s.visitId}`}>Open the visit</a>
          </Popup>
        </Marker>
      )))}
    </MapContainer>
  );
}
