import 'server-only';
import PDFDocument from 'pdfkit';
import type { SheetView } from '@/lib/shared/sheet/view-model';
import { INK, RULE, STONE, VERDICT_COLOURS, drawProfile, drawSiteMap, drawVerdictMark } from './pdf-drawings';
import { heightOf, registerFonts, write, type Face } from './pdf-fonts';

export type Paper = 'a4' | 'letter';
type Doc = InstanceType<typeof PDFDocument>;

function ensureRoom(doc: Doc, height: number) {
  if (doc.y + height > doc.page.height - doc.page.margins.bottom) doc.addPage();
}

function heading(doc: Doc, text: string) {
  ensureRoom(doc, 60);
  write(doc.moveDown(0.8).fontSize(14).fillColor('#1E3A4C'), 'bold', text);
  const y = doc.y + 2;
  doc.lineWidth(0.8).moveTo(doc.page.margins.left, y).lineTo(doc.page.width - doc.page.margins.right, y).stroke(RULE);
  doc.moveDown(0.4);
}

function body(doc: Doc, text: string, opts: { size?: number; colour?: string; face?: Face } = {}) {
  write(doc.fontSize(opts.size ?? 11).fillColor(opts.colour ?? INK), opts.face ?? 'sans', text, null, { lineGap: 2 });
}

function twoColumns(doc: Doc, rows: { left: string; right: string; sub?: string }[], split = 0.5) {
  const x = doc.page.margins.left;
  const w = doc.page.width - doc.page.margins.left - doc.page.margins.right;
  const lw = w * split - 8;
  const rw = w * (1 - split);
  for (const row of rows) {
    const hl = heightOf(doc.fontSize(11), 'sans', row.left, { width: lw }) + (row.sub ? heightOf(doc.fontSize(9), 'sans', row.sub, { width: lw }) : 0);
    const hr = heightOf(doc.fontSize(11), 'mono', row.right, { width: rw });
    const h = Math.max(hl, hr) + 6;
    ensureRoom(doc, h);
    const y = doc.y;
    write(doc.fontSize(11).fillColor(INK), 'sans', row.left, { x, y }, { width: lw });
    if (row.sub) write(doc.fontSize(9).fillColor(STONE), 'sans', row.sub, { x, y: doc.y }, { width: lw });
    write(doc.fontSize(11).fillColor(INK), 'mono', row.right, { x: x + lw + 8, y }, { width: rw });
    doc.lineWidth(0.5).moveTo(x, y + h - 3).lineTo(x + w, y + h - 3).stroke(RULE);
    doc.x = x;
    doc.y = y + h;
  }
}

function list(doc: Doc, items: string[]) {
  for (const item of items) {
    ensureRoom(doc, 30);
    body(doc, `• ${item}`);
    doc.moveDown(0.2);
  }
}

function header(doc: Doc, v: SheetView) {
  const x = doc.page.margins.left;
  write(doc.fontSize(9).fillColor(STONE), 'sans', 'Fallbook · site sheet for a hydraulic ram pump');
  write(doc.moveDown(0.3).fontSize(22).fillColor(INK), 'bold', v.farmName);
  body(doc, [v.area, v.ownerName ? `for ${v.ownerName}` : ''].filter(Boolean).join(' · '), { colour: STONE });
  doc.moveDown(0.6);
  const y = doc.y;
  drawVerdictMark(doc, v.verdict, x, y, 30);
  write(doc.fontSize(20).fillColor(VERDICT_COLOURS[v.verdict]), 'bold', v.verdictWord, { x: x + 62, y: y + 3 });
  doc.x = x;
  doc.y = y + 40;
  body(doc, v.summary.join(' '), { size: 13 });
}

/** The sheet as a PDF (fonts embedded, see pdf-fonts.ts; drawings as vector paths) on A4 or US Letter. */
export async function renderSheetPdf(v: SheetView, paper: Paper): Promise<Buffer> {
  const doc = new PDFDocument({
    size: paper === 'letter' ? 'LETTER' : 'A4',
    margins: { top: 48, bottom: 56, left: 52, right: 52 },
    bufferPages: true,
    info: { Title: `Site sheet: ${v.farmName}`, Author: 'Fallbook', Subject: v.verdictWord },
  });
  registerFonts(doc);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;

  header(doc, v);
  heading(doc, 'Key figures');
  twoColumns(doc, v.figures.map((f) => ({ left: f.label, sub: f.note || undefined, right: f.value })), 0.45);

  if (v.profile) {
    const h = v.profile.height * (width / v.profile.width);
    ensureRoom(doc, h + 80);
    heading(doc, 'The water path, from intake to tank');
    const y = doc.y;
    drawProfile(doc, v.profile, left, y, width);
    doc.x = left;
    doc.y = y + h + 4;
    body(doc, [v.profile.exaggeration, 'Drive pipe solid, delivery pipe dashed.'].filter(Boolean).join('. '), { size: 9, colour: STONE });
  }
  if (v.map) {
    const mw = Math.min(300, width);
    const h = v.map.height * (mw / v.map.width);
    ensureRoom(doc, h + 70);
    heading(doc, 'Where the points are');
    const y = doc.y;
    drawSiteMap(doc, v.map, left, y, mw);
    doc.x = left;
    doc.y = y + h + 6;
  }
  heading(doc, v.verdict === 'no-go' ? 'Why not' : v.verdict === 'gravity' ? 'What to check' : 'Conditions for a go');
  if (v.conditions.length) list(doc, v.conditions);
  else if (v.verdict !== 'no-go') body(doc, 'No extra conditions: follow the cautions below.');
  if (v.reasons.length) list(doc, v.reasons);

  heading(doc, 'Bill of materials');
  twoColumns(doc, v.billOfMaterials.map((b) => ({ left: b.item, sub: b.note, right: `${b.size === '—' ? '' : `${b.size}  ·  `}${b.quantity}` })), 0.6);

  heading(doc, 'Cautions');
  for (const c of v.cautions) {
    ensureRoom(doc, 50);
    body(doc, c.title, { face: 'bold' });
    body(doc, c.text);
    doc.moveDown(0.4);
  }
  body(doc, 'Local codes and licensed practice come first: have a qualified person check the design before you buy or build.', { face: 'bold' });

  heading(doc, 'How we worked this out');
  body(doc, v.surveyed);
  doc.moveDown(0.3);
  for (const line of v.method) body(doc, line, { size: 10 });
  doc.moveDown(0.3);
  body(doc, `Screening engine version ${v.engineVersion}. Sources behind the rules:`, { size: 10 });
  for (const s of v.sources) body(doc, `${s.id}: ${s.citation}`, { size: 8, colour: STONE });

  const pages = doc.bufferedPageRange();
  for (let i = 0; i < pages.count; i++) {
    doc.switchToPage(pages.start + i);
    // Writing below the bottom margin would start a new page: lift the margin for the footer.
    doc.page.margins.bottom = 0;
    const y = doc.page.height - 36;
    write(doc.fontSize(8).fillColor(STONE), 'sans', `${v.farmName} · ${v.verdictWord} · a first check, not an engineering design · page ${i + 1} of ${pages.count}`, { x: left, y }, { width, align: 'center', lineBreak: false });
  }
  doc.end();
  return done;
}
