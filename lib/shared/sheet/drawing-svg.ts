// The sheet's two drawings as SVG markup: the page shows this markup and the PDF draws the very same
// markup (svg-to-pdfkit), so the two cannot drift apart. Every text is escaped: labels come from people.
import { LABEL_SIZE, NOTE_SIZE, nodeLabelAt, profileLabelAt, type ProfileGeometry } from './profile';
import { MAP_LABEL_SIZE, type SiteMapGeometry } from './site-map';

// Fallbook's palette (each ink at least 7:1 on the paper ground); drawings must also read in greyscale
// (dash patterns, shapes, labels), since sheets are often printed in black and white.
export const DRAWING_COLOURS = { ink: '#15191C', stone: '#4F555A', creek: '#184F69', rule: '#C9C4B6' } as const;
const C = DRAWING_COLOURS;

export interface SvgOptions {
  /**
   * The label cut into runs, each with a font family that has its letters (the PDF's font chains);
   * without it the page's own font and the browser's fallback draw the text.
   */
  runsFor?: (text: string, bold: boolean) => { font: string; text: string }[];
  testId?: string;
}

const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
/** Text safe inside an element or a double-quoted attribute. */
export const esc = (text: string): string => text.replace(/[&<>"']/g, (ch) => ESCAPES[ch] ?? ch);

const n = (v: number) => String(Math.round(v * 100) / 100);

function text(
  o: SvgOptions,
  t: string,
  x: number,
  y: number,
  attrs: { size: number; bold?: boolean; anchor?: 'start' | 'middle' | 'end'; fill?: string },
): string {
  const runs = o.runsFor?.(t, attrs.bold ?? false);
  const family = runs?.length === 1 ? runs[0]?.font : undefined;
  const body = runs && runs.length > 1 ? runs.map((r) => `<tspan font-family="${esc(r.font)}">${esc(r.text)}</tspan>`).join('') : esc(t);
  return `<text x="${n(x)}" y="${n(y)}" font-size="${attrs.size}"${attrs.bold ? ' font-weight="bold"' : ''}${attrs.anchor && attrs.anchor !== 'start' ? ` text-anchor="${attrs.anchor}"` : ''}${family ? ` font-family="${esc(family)}"` : ''} fill="${attrs.fill ?? C.ink}">${body}</text>`;
}

function open(g: { width: number; height: number; description: string }, o: SvgOptions): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${g.width} ${g.height}" width="100%" style="display:block;height:auto;background:#fff" role="img" aria-label="${esc(g.description)}"${o.testId ? ` data-testid="${esc(o.testId)}"` : ''}>`;
}

/** The elevation profile: grid, pipes (drive solid, delivery dashed), intake, ram and tank with labels. */
export function profileSvg(g: ProfileGeometry, o: SvgOptions = {}): string {
  const parts = [open(g, o), `<rect x="0" y="0" width="${g.width}" height="${g.height}" fill="#fff"/>`];
  for (const l of g.yGrid) {
    parts.push(`<line x1="${n(g.plot.x)}" x2="${n(g.plot.x + g.plot.w)}" y1="${n(l.at)}" y2="${n(l.at)}" stroke="${C.rule}" stroke-width="0.8"/>`);
    parts.push(text(o, l.label, g.plot.x - 6, l.at + 4, { size: NOTE_SIZE, anchor: 'end', fill: C.stone }));
  }
  g.xGrid.forEach((l, i) => {
    parts.push(`<line x1="${n(l.at)}" x2="${n(l.at)}" y1="${n(g.plot.y)}" y2="${n(g.plot.y + g.plot.h)}" stroke="${C.rule}" stroke-width="0.8"/>`);
    // The last distance label ends at its line so it stays inside the frame.
    const last = i === g.xGrid.length - 1 && l.at > g.width - 40;
    parts.push(text(o, l.label, l.at, g.plot.y + g.plot.h + 16, { size: NOTE_SIZE, anchor: last ? 'end' : 'middle', fill: C.stone }));
  });
  for (const p of g.pipes) {
    parts.push(
      `<line x1="${n(p.x1)}" y1="${n(p.y1)}" x2="${n(p.x2)}" y2="${n(p.y2)}" stroke="${C.creek}" stroke-width="4"${p.key === 'delivery' ? ' stroke-dasharray="10 4"' : ''}/>`,
    );
  }
  for (const p of g.pipes) {
    const at = profileLabelAt(g, p);
    parts.push(text(o, p.label, at.anchor === 'end' ? at.x + at.width : at.x, at.y + 11, { size: LABEL_SIZE, bold: true, anchor: at.anchor }));
  }
  for (const node of g.nodes) {
    const at = nodeLabelAt(g, node);
    const x = at.anchor === 'end' ? at.x + at.width : at.x;
    parts.push(`<g data-node="${node.key}">`);
    if (node.key === 'tank')
      parts.push(`<rect x="${n(node.x - 14)}" y="${n(node.y - 20)}" width="16" height="20" fill="#fff" stroke="${C.ink}" stroke-width="2"/>`);
    if (node.key === 'pump') parts.push(`<rect x="${n(node.x - 7)}" y="${n(node.y - 7)}" width="14" height="14" fill="${C.ink}"/>`);
    if (node.key === 'intake') parts.push(`<circle cx="${n(node.x)}" cy="${n(node.y)}" r="6" fill="#fff" stroke="${C.ink}" stroke-width="2"/>`);
    parts.push(text(o, node.label, x, at.y + 11, { size: LABEL_SIZE, bold: true, anchor: at.anchor }));
    parts.push(text(o, node.height, x, at.y + 25, { size: NOTE_SIZE, anchor: at.anchor, fill: C.stone }));
    parts.push('</g>');
  }
  parts.push('</svg>');
  return parts.join('');
}

/** The surveyed points on a plain north-up drawing with a scale bar (no map tiles needed). */
export function siteMapSvg(g: SiteMapGeometry, o: SvgOptions = {}): string {
  const b = g.scaleBar;
  const parts = [open(g, o), `<rect x="0.5" y="0.5" width="${g.width - 1}" height="${g.height - 1}" fill="#fff" stroke="${C.rule}"/>`];
  if (g.route.length > 1)
    parts.push(`<polyline points="${g.route.map((p) => `${n(p.x)},${n(p.y)}`).join(' ')}" fill="none" stroke="${C.creek}" stroke-width="2.5"/>`);
  for (const p of g.points) {
    parts.push(`<circle cx="${n(p.x)}" cy="${n(p.y)}" r="5" fill="#fff" stroke="${C.ink}" stroke-width="1.5"/>`);
    parts.push(text(o, p.label, p.labelX, p.labelY, { size: MAP_LABEL_SIZE, anchor: p.anchor }));
  }
  parts.push(
    `<path d="M${n(b.x)} ${n(b.y - 4)}v8M${n(b.x)} ${n(b.y)}h${n(b.length)}M${n(b.x + b.length)} ${n(b.y - 4)}v8" stroke="${C.ink}" stroke-width="2" fill="none"/>`,
  );
  parts.push(text(o, b.label, b.x + b.length + 6, b.y + 4, { size: MAP_LABEL_SIZE }));
  parts.push(`<path d="M${g.width - 20} 12l-6 16h12z" fill="${C.ink}"/>`);
  parts.push(text(o, 'N', g.width - 24, 42, { size: MAP_LABEL_SIZE, bold: true }));
  parts.push('</svg>');
  return parts.join('');
}
