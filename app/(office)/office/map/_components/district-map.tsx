'use client';

import dynamic from 'next/dynamic';
import type { MapFarmView, MapSiteView } from './district-map-view';

// Leaflet touches `window` when imported: load it in the browser only.
const DistrictMapView = dynamic(() => import('./district-map-view'), { ssr: false, loading: () => <p>Loading the map…</p> });

/** Client-side wrapper so the server page can pass the sites to a browser-only map. */
export function DistrictMap(props: { sites: MapSiteView[]; farms: MapFarmView[]; fit: [[number, number], [number, number]] | null }) {
  return <DistrictMapView {...props} />;
}
