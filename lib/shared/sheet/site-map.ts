// A small map of the surveyed points without tiles: lat/lon projected to local metres
// (equirectangular, fine over a few hundred metres), north up, with a scale bar.
import type { UnitSystem } from '../domain';
import { mToFt } from '../units';
import { niceStep, textWidth } from './profile';

export interface MapPointInput {
  role: string;
  label: string;
  lat: number;
  lon: number;
}
export interface MapPoint {
  role: string;
  label: string;
  x: number;
  y: number;
  /** Where the label's text starts or ends (SVG text-anchor), kept inside the frame. */
  labelX: number;
  labelY: number;
  anchor: 'start' | 'end';
}

export const MAP_LABEL_SIZE = 11;

export interface SiteMapGeometry {
  width: number;
  height: number;
  points: MapPoint[];
  /** Pipe route drawn straight between intake → pump → tank, in that order. */
  route: { x: number; y: number }[];
  scaleBar: { x: number; y: number; length: number; label: string };
  description: string;
}

const M_PER_DEG_LAT = 111_320;
const ROUTE_ORDER = ['intake', 'pump', 'tank'];

/** Geometry of the point map in a width × height box; null when fewer than two points have a position. */
export function siteMapGeometry(input: MapPointInput[], units: UnitSystem, width = 320, height = 240): SiteMapGeometry | null {
  if (input.length < 2) return null;
  const lat0 = input.reduce((s, p) => s + p.lat, 0) / input.length;
  const lon0 = input.reduce((s, p) => s + p.lon, 0) / input.length;
  const cos = Math.cos((lat0 * Math.PI) / 180);
  const local = input.map((p) => ({ ...p, e: (p.lon - lon0) * M_PER_DEG_LAT * cos, n: (p.lat - lat0) * M_PER_DEG_LAT }));
  const minE = Math.min(...local.map((p) => p.e));
  const maxE = Math.max(...local.map((p) => p.e));
  const minN = Math.min(...local.map((p) => p.n));
  const maxN = Math.max(...local.map((p) => p.n));
  const pad = 36;
  const spanE = Math.max(maxE - minE, 10);
  const spanN = Math.max(maxN - minN, 10);
  const scale = Math.min((width - 2 * pad) / spanE, (height - 2 * pad - 20) / spanN);
  const cx = width / 2;
  const cy = (height - 20) / 2;
  const midE = (minE + maxE) / 2;
  const midN = (minN + maxN) / 2;
  const points = local.map((p) => {
    const x = cx + (p.e - midE) * scale;
    const y = cy - (p.n - midN) * scale;
    // A label that would run past the right edge goes to the left of its point instead.
    const w = textWidth(p.label, MAP_LABEL_SIZE);
    const right = x + 8 + w <= width - 4;
    const labelX = right ? x + 8 : Math.max(x - 8, w + 4);
    return {
      role: p.role,
      label: p.label,
      x,
      y,
      labelX,
      labelY: Math.min(Math.max(y + 4, 14), height - 26),
      anchor: right ? ('start' as const) : ('end' as const),
    };
  });
  const route = ROUTE_ORDER.map((role) => points.find((p) => p.role === role))
    .filter((p): p is MapPoint => !!p)
    .map(({ x, y }) => ({ x, y }));

  const toUnits = (m: number) => (units === 'us' ? mToFt(m) : m);
  const unit = units === 'us' ? 'ft' : 'm';
  const barUnits = niceStep(toUnits((width - 2 * pad) / scale), 3);
  const barMetres = units === 'us' ? barUnits * 0.3048 : barUnits;
  const scaleBar = { x: pad, y: height - 14, length: barMetres * scale, label: `${barUnits} ${unit}` };
  const description = `Map of the points, north up: ${points.map((p) => p.label).join(', ')}. Scale bar ${scaleBar.label}.`;
  return { width, height, points, route, scaleBar, description };
}
