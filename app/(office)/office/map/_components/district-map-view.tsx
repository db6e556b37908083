'use client';

import 'leaflet/dist/leaflet.css';
import 'leaflet.markercluster/dist/MarkerCluster.css';
import L from 'leaflet';
import { useEffect } from 'react';
import { MapContainer, ScaleControl, TileLayer, useMap } from 'react-leaflet';
import { verdictSvg, VERDICT_WORDS } from '@/components/verdict-svg';
import type { Verdict } from '@/lib/shared/domain';
import { NO_VISIT_MARK } from './marks';

export interface MapSiteView {
  visitId: string;
  farmName: string;
  statusLabel: string;
  verdict: Verdict | null;
  points: { role: string; lat: number; lon: number }[];
}

export interface MapFarmView {
  farmId: string;
  farmName: string;
  area: string;
  lat: number;
  lon: number;
}

const ROLE_WORDS: Record<string, string> = {
  intake: 'at the intake',
  pump: 'at the pump site',
  tank: 'at the tank',
  source: 'at the source',
  other: 'at a point taken',
  farm: 'at the farm (no site points yet)',
};

// Popup content built as elements (names are people's own text, never markup).
function popup(lines: (string | { href: string; text: string })[], title: string): HTMLElement {
  const box = document.createElement('div');
  const strong = document.createElement('strong');
  strong.textContent = title;
  box.append(strong);
  for (const line of lines) {
    box.append(document.createElement('br'));
    if (typeof line === 'string') box.append(line);
    else {
      const a = document.createElement('a');
      a.href = line.href;
      a.textContent = line.text;
      box.append(a);
    }
  }
  return box;
}

// A neutral numbered circle for a gathered group (no verdict colour: it may hold every verdict).
const clusterIcon = (cluster: L.MarkerCluster) =>
  L.divIcon({
    html: `<span>${cluster.getChildCount()}</span>`,
    className: 'fallbook-cluster',
    iconSize: [40, 40],
  });

/** The marks in Leaflet.markercluster groups: near marks gather into a count, each mark is labelled with its farm. */
function ClusteredMarks({ sites, farms }: { sites: MapSiteView[]; farms: MapFarmView[] }) {
  const map = useMap();
  useEffect(() => {
    let group: L.MarkerClusterGroup | undefined;
    let cancelled = false;
    // The plugin extends the global L that Leaflet's own build sets; bring it in once Leaflet is loaded.
    (window as unknown as { L?: typeof L }).L ??= L;
    void import('leaflet.markercluster').then(() => {
      if (cancelled) return;
      const icons = new Map<string, L.DivIcon>();
      const iconFor = (v: Verdict | 'none') => {
        let icon = icons.get(v);
        if (!icon) icons.set(v, (icon = L.divIcon({ html: verdictSvg(v, 40), className: 'fallbook-marker', iconSize: [40, 24], iconAnchor: [20, 12] })));
        return icon;
      };
      const farmIcon = L.divIcon({ html: NO_VISIT_MARK, className: 'fallbook-marker', iconSize: [24, 24], iconAnchor: [12, 12] });
      // Wide groups keep the farms' labels apart at the district's zoom; zooming in opens them.
      group = L.markerClusterGroup({ iconCreateFunction: clusterIcon, showCoverageOnHover: false, maxClusterRadius: 60, spiderfyOnMaxZoom: true });
      for (const s of sites) {
        // One mark per site, at the ram's place when it was taken: the district view wants farms, not every point.
        const p = s.points.find((q) => q.role === 'pump') ?? s.points[0];
        if (!p) continue;
        const verdict = VERDICT_WORDS[s.verdict ?? 'none'];
        const where = s.points.length > 1 ? `${s.points.length} points taken` : (ROLE_WORDS[p.role] ?? p.role);
        group.addLayer(
          L.marker([p.lat, p.lon], { icon: iconFor(s.verdict ?? 'none'), title: `${s.farmName}: ${verdict}`, alt: `${s.farmName}: ${verdict}` })
            .bindPopup(popup([`${verdict} · ${s.statusLabel}`, where, { href: `/office/visits/${s.visitId}`, text: 'Open the visit' }], s.farmName))
            .bindTooltip(s.farmName, { permanent: true, direction: 'right', offset: [18, 0], className: 'fallbook-label' }),
        );
      }
      for (const f of farms) {
        group.addLayer(
          L.marker([f.lat, f.lon], { icon: farmIcon, title: `${f.farmName}: no visit yet`, alt: `${f.farmName}: no visit yet` })
            .bindPopup(popup([f.area || 'no area given', 'No visit yet', { href: `/office/visits/new?farm=${f.farmId}`, text: 'Plan a visit' }], f.farmName))
            .bindTooltip(f.farmName, { permanent: true, direction: 'right', offset: [12, 0], className: 'fallbook-label' }),
        );
      }
      map.addLayer(group);
    });
    return () => {
      cancelled = true;
      if (group) map.removeLayer(group);
    };
  }, [map, sites, farms]);
  return null;
}

/**
 * The district's sites and unvisited farms on a Leaflet map, fitted to `fit`; tiles only if
 * NEXT_PUBLIC_TILE_URL is set. The map names its own deepest zoom: the clusters need one, and
 * without tiles no layer gives it.
 */
export default function DistrictMapView({
  sites,
  farms,
  fit,
}: {
  sites: MapSiteView[];
  farms: MapFarmView[];
  fit: [[number, number], [number, number]] | null;
}) {
  const tileUrl = process.env.NEXT_PUBLIC_TILE_URL;
  const bounds = fit ? L.latLngBounds(fit).pad(0.1) : undefined;
  return (
    <MapContainer
      bounds={bounds}
      center={bounds ? undefined : [52.4, -3.6]}
      zoom={bounds ? undefined : 11}
      maxZoom={19}
      zoomSnap={0.5}
      scrollWheelZoom
      style={{ height: '60vh', minHeight: 360, background: '#EDEAE0' }}
      aria-label="Map of the district's sites"
    >
      {tileUrl && <TileLayer url={tileUrl} attribution={process.env.NEXT_PUBLIC_TILE_ATTRIBUTION ?? ''} />}
      <ScaleControl position="bottomleft" />
      <ClusteredMarks sites={sites} farms={farms} />
    </MapContainer>
  );
}
