import { siteMapSvg } from '@/lib/shared/sheet/drawing-svg';
import type { SiteMapGeometry } from '@/lib/shared/sheet/site-map';
import { Deferred } from './deferred-drawing';

/** The surveyed points, north up with a scale bar: the same SVG markup the PDF draws. */
export function SiteMapDrawing({ g }: { g: SiteMapGeometry }) {
  return <Deferred width={g.width} height={g.height} className="max-w-sm" html={siteMapSvg(g, { testId: 'site-map-drawing' })} />;
}
