import { siteMapSvg } from '@/lib/shared/sheet/drawing-svg';
import type { SiteMapGeometry } from '@/lib/shared/sheet/site-map';

/** The surveyed points, north up with a scale bar: the same SVG markup the PDF draws. */
export function SiteMapDrawing({ g }: { g: SiteMapGeometry }) {
  return <div className="max-w-sm" dangerouslySetInnerHTML={{ __html: siteMapSvg(g, { testId: 'site-map-drawing' }) }} />;
}
