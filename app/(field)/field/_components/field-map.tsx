'use client';

import 'leaflet/dist/leaflet.css';
import L from 'leaflet';
import { useEffect, type ReactNode } from 'react';
import { MapContainer, ScaleControl, TileLayer, useMap } from 'react-leaflet';
import { OFFLINE_MAX_ZOOM } from '@/lib/shared/map-tiles';

export type Place = [lat: number, lon: number];

/** The zoom for one place alone (a single point, or the farm before any point is taken). */
const SINGLE_ZOOM = 16;
/** The zoom control sits top left: fitted views keep markers this far from that corner. */
const CONTROL_CLEARANCE: L.PointTuple = [64, 24];

/**
 * Fits the view to the places whenever their set changes (first drawn, a point saved or deleted),
 * and brings `follow` into view whenever it moves (a new fix, typed coordinates, a dragged pin).
 */
function MapView({
  places,
  home,
  follow,
  padding,
  maxZoom,
}: {
  places: Place[];
  home: Place | null;
  follow: Place | null;
  padding: L.PointTuple;
  maxZoom: number;
}) {
  const map = useMap();
  const placesKey = JSON.stringify(places.length > 0 ? places : home ? [home] : []);
  const [padX, padY] = padding;
  useEffect(() => {
    const list = JSON.parse(placesKey) as Place[];
    if (list.length === 1) map.setView(list[0]!, Math.min(SINGLE_ZOOM, maxZoom));
    else if (list.length > 1) {
      map.fitBounds(L.latLngBounds(list), {
        paddingTopLeft: [Math.max(padX, CONTROL_CLEARANCE[0]), Math.max(padY, CONTROL_CLEARANCE[1])],
        paddingBottomRight: [padX, padY],
        maxZoom,
      });
    }
  }, [map, placesKey, padX, padY, maxZoom]);
  const [lat, lon] = follow ?? [null, null];
  useEffect(() => {
    if (lat === null || lon === null) return;
    // Already well inside the view: leave the person's zoom and framing alone.
    if (map.getBounds().pad(-0.15).contains([lat, lon])) return;
    map.setView([lat, lon], Math.max(map.getZoom(), SINGLE_ZOOM - 1));
  }, [map, lat, lon]);
  return null;
}

/**
 * The field pages' map frame: the organisation's tiles (kept on the phone around its visits, so
 * they show with no signal), our own lines and markers, a scale. With no tiles configured it is
 * still a working map on paper. It opens on the places (or the farm), never on the whole world.
 */
export function FieldMap({
  places,
  home = null,
  follow = null,
  padding = [24, 24],
  maxZoom = 18,
  label,
  children,
}: {
  /** What the map must show; fitted whenever the set changes. */
  places: Place[];
  /** Where to look when there are no places yet (the farm). */
  home?: Place | null;
  /** Brought into view whenever it moves. */
  follow?: Place | null;
  padding?: L.PointTuple;
  maxZoom?: number;
  label?: string;
  children: ReactNode;
}) {
  const tiles = process.env.NEXT_PUBLIC_TILE_URL;
  const first = places.length > 0 ? places : home ? [home] : [];
  return (
    <div className="space-y-1">
      <MapContainer
        bounds={first.length > 1 ? L.latLngBounds(first) : undefined}
        center={first.length > 1 ? undefined : (first[0] ?? [0, 0])}
        zoom={first.length > 1 ? undefined : first.length === 1 ? Math.min(SINGLE_ZOOM, maxZoom) : 2}
        boundsOptions={{ paddingTopLeft: CONTROL_CLEARANCE, paddingBottomRight: padding, maxZoom }}
        className="field-map h-72 w-full rounded-md border border-rule"
        style={{ background: '#EDEAE0' }}
        aria-label={label}
      >
        {/* Above the top kept zoom the phone enlarges the kept tiles, so a close look works offline too. */}
        {tiles && <TileLayer url={tiles} attribution={process.env.NEXT_PUBLIC_TILE_ATTRIBUTION ?? ''} maxNativeZoom={OFFLINE_MAX_ZOOM} maxZoom={20} />}
        <ScaleControl position="bottomleft" />
        <MapView places={places} home={home} follow={follow} padding={padding} maxZoom={maxZoom} />
        {children}
      </MapContainer>
      {first.length === 0 && (
        <p className="text-stone" data-testid="map-nowhere">
          Nothing to centre on yet: this farm has no position on record. Use my location or type the coordinates.
        </p>
      )}
    </div>
  );
}
