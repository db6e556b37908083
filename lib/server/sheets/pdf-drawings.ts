import 'server-only';
import type PDFDocument from 'pdfkit';
import { VERDICT_COLOURS, type Verdict } from '@/lib/shared/domain';
import SVGtoPDF from 'svg-to-pdfkit';
import { DRAWING_COLOURS, profileSvg, siteMapSvg } from '@/lib/shared/sheet/drawing-svg';
import type { ProfileGeometry } from '@/lib/shared/sheet/profile';
import type { SiteMapGeometry } from '@/lib/shared/sheet/site-map';
import { fontRuns, isRegisteredFont } from './pdf-fonts';

type Doc = InstanceType<typeof PDFDocument>;

export const INK = DRAWING_COLOURS.ink;
export const STONE = DRAWING_COLOURS.stone;
export const RULE = DRAWING_COLOURS.rule;
export { VERDICT_COLOURS };

/** The verdict's level vial (same shape as the page's VerdictMark), `h` points high at (x, y). */
export function drawVerdictMark(doc: Doc, verdict: Verdict, x: number, y: number, h: number): void {
  const s = h / 28;
  const c = VERDICT_COLOURS[verdict];
  doc.save().translate(x, y).scale(s);
  doc.lineWidth(2.5).roundedRect(2, 6, 44, 16, 8).stroke(c);
  doc.lineWidth(2).moveTo(18, 6).lineTo(18, 22).stroke(c).moveTo(30, 6).lineTo(30, 22).stroke(c);
  if (verdict === 'no-go') doc.lineWidth(3.5).lineCap('round').moveTo(4, 26).lineTo(44, 2).stroke(c);
  else if (verdict === 'gravity')
    doc.lineWidth(3).lineCap('round').moveTo(6, 14).quadraticCurveTo(12, 8, 18, 14).quadraticCurveTo(24, 20, 30, 14).quadraticCurveTo(36, 8, 42, 14).stroke(c);
  else doc.ellipse(verdict === 'go' ? 24 : 36, 14, 5, 4).fill(c);
  doc.restore();
}

// svg-to-pdfkit asks for a font by the family the markup names (fontRuns picked, for each run of a
// label, a font that has its letters); any other family (svg-to-pdfkit's default is sans-serif)
// gets the sheet's own face.
const runsFor = (text: string, bold: boolean) => fontRuns(text, bold ? 'bold' : 'sans');
function draw(doc: Doc, svg: string, x: number, y: number, width: number, height: number) {
  SVGtoPDF(doc as unknown as Parameters<typeof SVGtoPDF>[0], svg, x, y, {
    width,
    height,
    assumePt: true,
    preserveAspectRatio: 'xMinYMin meet',
    fontCallback: (family, bold) => (isRegisteredFont(family) ? family : bold ? 'atkinson-700' : 'atkinson-400'),
  });
}

/** The elevation profile, `width` points wide at (x, y): the page's own SVG. Returns its height. */
export function drawProfile(doc: Doc, g: ProfileGeometry, x: number, y: number, width: number): number {
  const height = g.height * (width / g.width);
  draw(doc, profileSvg(g, { runsFor }), x, y, width, height);
  return height;
}

/** The point map with its scale bar and north arrow, `width` points wide at (x, y): the page's own SVG. */
export function drawSiteMap(doc: Doc, g: SiteMapGeometry, x: number, y: number, width: number): number {
  const height = g.height * (width / g.width);
  draw(doc, siteMapSvg(g, { runsFor }), x, y, width, height);
  return height;
}
