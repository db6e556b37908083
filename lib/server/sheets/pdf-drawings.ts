import 'server-only';
import type PDFDocument from 'pdfkit';
import { VERDICT_COLOURS, type Verdict } from '@/lib/shared/domain';
import { write } from './pdf-fonts';
import { LABEL_SIZE, NOTE_SIZE, nodeLabelAt, profileLabelAt, type LabelAnchor, type ProfileGeometry } from '@/lib/shared/sheet/profile';
import { MAP_LABEL_SIZE, type SiteMapGeometry } from '@/lib/shared/sheet/site-map';

type Doc = InstanceType<typeof PDFDocument>;

// The palette of LOOK.md; drawings must also read in greyscale (dash patterns, shapes, labels).
export const INK = '#15191C';
export const STONE = '#4F555A';
export const CREEK = '#184F69';
export const RULE = '#C9C4B6';
export { VERDICT_COLOURS };

/** The verdict's level vial (same shape as the page's VerdictMark), `h` points high at (x, y). */
export function drawVerdictMark(doc: Doc, verdict: Verdict, x: number, y: number, h: number): void {
  const s = h / 28;
  const c = VERDICT_COLOURS[verdict];
  doc.save().translate(x, y).scale(s);
  doc.lineWidth(2.5).roundedRect(2, 6, 44, 16, 8).stroke(c);
  doc.lineWidth(2).moveTo(18, 6).lineTo(18, 22).stroke(c).moveTo(30, 6).lineTo(30, 22).stroke(c);
  if (verdict === 'no-go') doc.lineWidth(3.5).lineCap('round').moveTo(4, 26).lineTo(44, 2).stroke(c);
  else if (verdict === 'gravity') doc.lineWidth(3).lineCap('round').lineJoin('round').moveTo(19, 10).lineTo(24, 17).lineTo(29, 10).stroke(c);
  else doc.ellipse(verdict === 'go' ? 24 : 36, 14, 5, 4).fill(c);
  doc.restore();
}

// pdfkit wraps a line that overruns its box: give each label a little slack on its open side.
const SLACK = 24;
function room(at: LabelAnchor, dy = 0): [{ x: number; y: number }, { width: number; align: 'left' | 'right'; lineBreak: false }] {
  return [{ x: at.align === 'right' ? at.x - SLACK : at.x, y: at.y + dy }, { width: at.width + SLACK, align: at.align, lineBreak: false }];
}

/** The elevation profile, scaled from its geometry box to `width` points wide at (x, y). */
export function drawProfile(doc: Doc, g: ProfileGeometry, x: number, y: number, width: number): number {
  const s = width / g.width;
  doc.save().translate(x, y).scale(s);
  const { plot } = g;
  doc.lineWidth(0.6).strokeColor(RULE);
  for (const line of g.yGrid) {
    doc.moveTo(plot.x, line.at).lineTo(plot.x + plot.w, line.at).stroke();
    write(doc.fontSize(10).fillColor(STONE), 'sans', line.label, { x: 0, y: line.at - 6 }, { width: plot.x - 6, align: 'right', lineBreak: false });
  }
  for (const line of g.xGrid) {
    doc.moveTo(line.at, plot.y).lineTo(line.at, plot.y + plot.h).stroke(RULE);
    write(doc.fontSize(10).fillColor(STONE), 'sans', line.label, { x: line.at - 30, y: plot.y + plot.h + 6 }, { width: 60, align: 'center', lineBreak: false });
  }
  // Water path: drive pipe solid, delivery pipe dashed, so the two read apart in greyscale.
  for (const pipe of g.pipes) {
    doc.lineWidth(4).strokeColor(CREEK);
    if (pipe.key === 'delivery') doc.dash(10, { space: 4 });
    doc.moveTo(pipe.x1, pipe.y1).lineTo(pipe.x2, pipe.y2).stroke();
    doc.undash();
  }
  for (const pipe of g.pipes) {
    const label = profileLabelAt(g, pipe);
    write(doc.fontSize(LABEL_SIZE).fillColor(INK), 'bold', pipe.label, ...room(label));
  }
  for (const node of g.nodes) {
    if (node.key === 'tank') doc.lineWidth(2).rect(node.x - 14, node.y - 20, 16, 20).fillAndStroke('#FFFFFF', INK);
    else if (node.key === 'pump') doc.lineWidth(2).rect(node.x - 7, node.y - 7, 14, 14).fillAndStroke(INK, INK);
    else doc.lineWidth(2).circle(node.x, node.y, 6).fillAndStroke('#FFFFFF', INK);
    const at = nodeLabelAt(g, node);
    write(doc.fontSize(LABEL_SIZE).fillColor(INK), 'bold', node.label, ...room(at));
    write(doc.fontSize(NOTE_SIZE).fillColor(STONE), 'sans', node.height, ...room(at, 15));
  }
  doc.restore();
  return g.height * s;
}

/** The point map with a scale bar and north arrow, scaled to `width` points wide at (x, y). */
export function drawSiteMap(doc: Doc, g: SiteMapGeometry, x: number, y: number, width: number): number {
  const s = width / g.width;
  doc.save().translate(x, y).scale(s);
  doc.lineWidth(1).rect(0, 0, g.width, g.height).stroke(RULE);
  if (g.route.length > 1) {
    doc.lineWidth(2.5).strokeColor(CREEK).moveTo(g.route[0]?.x ?? 0, g.route[0]?.y ?? 0);
    for (const p of g.route.slice(1)) doc.lineTo(p.x, p.y);
    doc.stroke();
  }
  for (const p of g.points) {
    doc.lineWidth(1.5).circle(p.x, p.y, 5).fillAndStroke('#FFFFFF', INK);
    const w = doc.fontSize(MAP_LABEL_SIZE).widthOfString(p.label);
    write(doc.fillColor(INK), 'sans', p.label, { x: p.anchor === 'start' ? p.labelX : p.labelX - w, y: p.labelY - 10 }, { lineBreak: false });
  }
  const bar = g.scaleBar;
  doc.lineWidth(2).moveTo(bar.x, bar.y).lineTo(bar.x + bar.length, bar.y).stroke(INK);
  doc.moveTo(bar.x, bar.y - 4).lineTo(bar.x, bar.y + 4).stroke().moveTo(bar.x + bar.length, bar.y - 4).lineTo(bar.x + bar.length, bar.y + 4).stroke();
  write(doc.fontSize(10).fillColor(INK), 'sans', bar.label, { x: bar.x + bar.length + 6, y: bar.y - 6 }, { lineBreak: false });
  doc.polygon([g.width - 20, 12], [g.width - 26, 28], [g.width - 14, 28]).fill(INK);
  write(doc.fontSize(10), 'bold', 'N', { x: g.width - 24, y: 30 }, { lineBreak: false });
  doc.restore();
  return g.height * s;
}
