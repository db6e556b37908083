'use client';

import 'leaflet/dist/leaflet.css';
import type { LatLngBoundsExpression, LatLngExpression } from 'leaflet';
import type { ReactNode } from 'react';
import { MapContainer, ScaleControl, TileLayer } from 'react-leaflet';

/**
 * The field pages' map frame. Tiles only when NEXT_PUBLIC_TILE_URL is set: with no tiles (no signal,
 * or none configured) it is still a working map of our own lines and markers on paper, with a scale.
 */
export function FieldMap({ center, zoom, bounds, label, children }: {
  center?: LatLngExpression;
  zoom?: number;
  /** Fit to these instead of center/zoom. */
  bounds?: LatLngBoundsExpression;
  label?: string;
  children: ReactNode;
}) {
  const tiles = process.env.NEXT_PUBLIC_TILE_URL;
  return (
    <MapContainer center={bounds ? undefined : center} zoom={bounds ? undefined : zoom} bounds={bounds} boundsOptions={{ padding: [24, 24] }}
      className="h-72 w-full rounded-md border border-rule" style={{ background: '#EDEAE0' }} aria-label={label}>
      {tiles && <TileLayer url={tiles} attribution={process.env.NEXT_PUBLIC_TILE_ATTRIBUTION ?? ''} />}
      <ScaleControl position="bottomleft" />
      {children}
    </MapContainer>
  );
}
