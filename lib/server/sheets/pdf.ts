import 'server-only';
import PDFDocument from 'pdfkit';
import type { SheetSourceLine, SheetView } from '@/lib/shared/sheet/view-model';
import { INK, RULE, STONE, VERDICT_COLOURS, drawProfile, drawSiteMap, drawVerdictMark } from './pdf-drawings';
import { heightOf, registerFonts, write, type Face } from './pdf-fonts';

export type Paper = 'a4' | 'letter';
type Doc = InstanceType<typeof PDFDocument>;

const bottom = (doc: Doc) => doc.page.height - doc.page.margins.bottom;
const contentWidth = (doc: Doc) => doc.page.width - doc.page.margins.left - doc.page.margins.right;

function ensureRoom(doc: Doc, height: number) {
  if (doc.y + height > bottom(doc)) doc.addPage();
}

// A heading's own height on the page, with the space above and the rule below it.
const HEADING_H = 34;

/** A section heading kept on the same page as the first `next` points of what follows it. */
function heading(doc: Doc, text: string, next: number) {
  ensureRoom(doc, HEADING_H + next);
  write(doc.moveDown(0.8).fontSize(14).fillColor('#1E3A4C'), 'bold', text, { x: doc.page.margins.left, y: doc.y });
  const y = doc.y + 2;
  doc
    .lineWidth(0.8)
    .moveTo(doc.page.margins.left, y)
    .lineTo(doc.page.width - doc.page.margins.right, y)
    .stroke(RULE);
  doc.moveDown(0.4);
}

function body(doc: Doc, text: string, opts: { size?: number; colour?: string; face?: Face } = {}) {
  write(
    doc.fontSize(opts.size ?? 11).fillColor(opts.colour ?? INK),
    opts.face ?? 'sans',
    text,
    { x: doc.page.margins.left, y: doc.y },
    { lineGap: 2, width: contentWidth(doc) },
  );
}

/** A source under "Where the numbers come from": a bullet, then its name, which links to the document where it has an address. */
function sourceLine(doc: Doc, s: SheetSourceLine) {
  const opts = { lineGap: 2, width: contentWidth(doc) };
  write(doc.fontSize(8.5).fillColor(STONE), 'sans', '• ', { x: doc.page.margins.left, y: doc.y }, { ...opts, continued: true });
  write(doc, 'sans', s.citation, null, s.url ? { ...opts, link: s.url } : opts);
}

const bodyHeight = (doc: Doc, text: string, size = 11, face: Face = 'sans') =>
  heightOf(doc.fontSize(size), face, text, { lineGap: 2, width: contentWidth(doc) });

export interface Column {
  title: string;
  share: number;
  face?: Face;
}
export interface Cell {
  text: string;
  sub?: string;
}

const CELL_GAP = 8;

function cellHeight(doc: Doc, cell: Cell, col: Column, width: number): number {
  const main = heightOf(doc.fontSize(10.5), col.face ?? 'sans', cell.text, { width });
  return main + (cell.sub ? heightOf(doc.fontSize(9), 'sans', cell.sub, { width }) : 0);
}

/** A table whose column headings repeat at the top of each page it runs onto. */
function table(doc: Doc, columns: Column[], rows: Cell[][]) {
  const x0 = doc.page.margins.left;
  const w = contentWidth(doc);
  const widths = columns.map((c) => c.share * w - CELL_GAP);
  const xs = columns.map((_, i) => x0 + columns.slice(0, i).reduce((a, c) => a + c.share * w, 0));
  const heads = () => {
    const y = doc.y;
    columns.forEach((c, i) => write(doc.fontSize(9).fillColor(STONE), 'bold', c.title, { x: xs[i] ?? x0, y }, { width: widths[i], lineBreak: false }));
    doc
      .lineWidth(0.8)
      .moveTo(x0, y + 14)
      .lineTo(x0 + w, y + 14)
      .stroke(STONE);
    doc.x = x0;
    doc.y = y + 18;
  };
  heads();
  for (const row of rows) {
    const h = Math.max(...row.map((cell, i) => cellHeight(doc, cell, columns[i] ?? { title: '', share: 0 }, widths[i] ?? 0))) + 7;
    if (doc.y + h > bottom(doc)) {
      doc.addPage();
      heads();
    }
    const y = doc.y;
    row.forEach((cell, i) => {
      const at = { x: xs[i] ?? x0, y };
      write(doc.fontSize(10.5).fillColor(INK), columns[i]?.face ?? 'sans', cell.text, at, { width: widths[i] });
      if (cell.sub) write(doc.fontSize(9).fillColor(STONE), 'sans', cell.sub, { x: at.x, y: doc.y }, { width: widths[i] });
    });
    doc
      .lineWidth(0.5)
      .moveTo(x0, y + h - 3)
      .lineTo(x0 + w, y + h - 3)
      .stroke(RULE);
    doc.x = x0;
    doc.y = y + h;
  }
}

/** The height of a table's headings and first row, to keep a heading with them. */
function tableStart(doc: Doc, columns: Column[], first: Cell[] | undefined): number {
  if (!first) return 0;
  const w = contentWidth(doc);
  return 18 + Math.max(...first.map((cell, i) => cellHeight(doc, cell, columns[i] ?? { title: '', share: 0 }, (columns[i]?.share ?? 0) * w - CELL_GAP))) + 7;
}

interface Figure {
  label: string;
  value: string;
  note: string;
}

function figureCellHeight(doc: Doc, f: Figure, width: number): number {
  return (
    heightOf(doc.fontSize(9), 'sans', f.label, { width }) +
    heightOf(doc.fontSize(11), 'mono', f.value, { width }) +
    (f.note ? heightOf(doc.fontSize(8.5), 'sans', f.note, { width }) : 0)
  );
}

const PER_ROW = 3;
const figureCellWidth = (doc: Doc) => (contentWidth(doc) - 16 * (PER_ROW - 1)) / PER_ROW;

/** The key figures three to a row (so the drawing fits on page 1): label, value, what it means. */
function figureGrid(doc: Doc, figures: Figure[]) {
  const x0 = doc.page.margins.left;
  const w = contentWidth(doc);
  const cw = figureCellWidth(doc);
  for (let i = 0; i < figures.length; i += PER_ROW) {
    const pair = figures.slice(i, i + PER_ROW);
    const h = Math.max(...pair.map((f) => figureCellHeight(doc, f, cw))) + 8;
    ensureRoom(doc, h);
    const y = doc.y;
    pair.forEach((f, j) => {
      const x = x0 + j * (cw + 16);
      write(doc.fontSize(9).fillColor(STONE), 'sans', f.label, { x, y }, { width: cw });
      write(doc.fontSize(11).fillColor(INK), 'mono', f.value, { x, y: doc.y }, { width: cw });
      if (f.note) write(doc.fontSize(8.5).fillColor(STONE), 'sans', f.note, { x, y: doc.y }, { width: cw });
    });
    doc
      .lineWidth(0.5)
      .moveTo(x0, y + h - 4)
      .lineTo(x0 + w, y + h - 4)
      .stroke(RULE);
    doc.x = x0;
    doc.y = y + h;
  }
}

function list(doc: Doc, items: string[]) {
  for (const item of items) {
    ensureRoom(doc, Math.min(bodyHeight(doc, `• ${item}`), 60));
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
  const width = contentWidth(doc);

  header(doc, v);
  heading(doc, 'Key figures', v.figures[0] ? figureCellHeight(doc, v.figures[0], figureCellWidth(doc)) + 8 : 0);
  figureGrid(doc, v.figures);

  if (v.profile) {
    // Fill what is left of the page with the drawing, down to 60 % of the full width; else a new page.
    const caption = 24;
    const room = bottom(doc) - doc.y - HEADING_H - caption - 12;
    const full = v.profile.height * (width / v.profile.width);
    const scale = full <= room ? 1 : Math.max(room / full, 0);
    const drawWidth = scale >= 0.6 ? width * scale : width;
    const h = v.profile.height * (drawWidth / v.profile.width);
    heading(doc, 'The water path, from intake to tank', h + caption);
    const y = doc.y;
    drawProfile(doc, v.profile, left, y, drawWidth);
    doc.x = left;
    doc.y = y + h + 4;
    body(doc, [v.profile.exaggeration, v.profile.legend].filter(Boolean).join('. '), { size: 9, colour: STONE });
  }
  if (v.map) {
    const mw = Math.min(300, width);
    const h = v.map.height * (mw / v.map.width);
    heading(doc, 'Where the points are', h + 6);
    const y = doc.y;
    drawSiteMap(doc, v.map, left, y, mw);
    doc.x = left;
    doc.y = y + h + 6;
  }
  const conditionLines = v.conditions.length
    ? v.conditions.map((c) => `• ${c}`)
    : v.verdict !== 'no-go'
      ? ['No extra conditions: follow the cautions below.']
      : [];
  const firstLine = conditionLines[0] ?? (v.reasons[0] ? `• ${v.reasons[0]}` : '');
  heading(doc, v.verdict === 'no-go' ? 'Why not' : v.verdict === 'gravity' ? 'What to check' : 'Conditions for a go', bodyHeight(doc, firstLine));
  if (v.conditions.length) list(doc, v.conditions);
  else if (v.verdict !== 'no-go') body(doc, 'No extra conditions: follow the cautions below.');
  if (v.reasons.length) list(doc, v.reasons);

  const billColumns: Column[] = [
    { title: 'Item', share: 0.31 },
    { title: 'Size', share: 0.16 },
    { title: 'Quantity', share: 0.12, face: 'mono' },
    { title: 'Basis', share: 0.26 },
    { title: 'Price', share: 0.15, face: 'mono' },
  ];
  const billRows: Cell[][] = [
    ...v.billOfMaterials.map((b) => [{ text: b.item, sub: b.note }, { text: b.size }, { text: b.quantity }, { text: b.basis }, { text: b.price }]),
    ...(v.costs ? v.costs.extras.map((e) => [{ text: e.item }, { text: '' }, { text: '' }, { text: e.basis }, { text: e.price }]) : []),
    ...(v.costs ? [[{ text: 'Total' }, { text: '' }, { text: '' }, { text: '' }, { text: v.costs.total }]] : []),
  ];
  heading(doc, 'Bill of materials', tableStart(doc, billColumns, billRows[0]));
  table(doc, billColumns, billRows);

  if (v.costs?.comparison) {
    const tenColumns: Column[] = [
      { title: 'Option', share: 0.32 },
      { title: 'To buy and fit', share: 0.17, face: 'mono' },
      { title: 'Bought again', share: 0.17, face: 'mono' },
      { title: 'Upkeep and fuel', share: 0.17, face: 'mono' },
      { title: 'Ten years', share: 0.17, face: 'mono' },
    ];
    const tenRows: Cell[][] = v.costs.comparison.map((o) => [
      { text: o.option },
      { text: o.capital },
      { text: o.replacements },
      { text: o.running },
      { text: o.total },
    ]);
    // Three rows: the whole table stays on one page with its heading.
    const whole = tenRows.reduce((h, row) => h + tableStart(doc, tenColumns, row) - 18, 18);
    heading(doc, 'Ten years: a ram, a solar pump or a petrol pump', whole);
    table(doc, tenColumns, tenRows);
    body(doc, 'What these figures assume', { face: 'bold' });
    list(doc, v.costs.assumptions);
  } else if (v.costs) {
    body(doc, v.costs.assumptions[0] ?? '', { colour: STONE });
  }

  const first = v.cautions[0];
  heading(doc, 'Cautions', first ? bodyHeight(doc, first.title, 11, 'bold') + bodyHeight(doc, first.text) : 0);
  for (const c of v.cautions) {
    // A caution's title stays with its text.
    ensureRoom(doc, bodyHeight(doc, c.title, 11, 'bold') + Math.min(bodyHeight(doc, c.text), 80));
    body(doc, c.title, { face: 'bold' });
    body(doc, c.text);
    doc.moveDown(0.4);
  }
  const lastWord = 'Local codes and licensed practice come first: have a qualified person check the design before you buy or build.';
  ensureRoom(doc, bodyHeight(doc, lastWord, 11, 'bold'));
  body(doc, lastWord, { face: 'bold' });

  heading(doc, 'How we worked this out', bodyHeight(doc, v.surveyed));
  body(doc, v.surveyed);
  doc.moveDown(0.3);
  for (const line of v.method) {
    ensureRoom(doc, bodyHeight(doc, line, 10));
    body(doc, line, { size: 10 });
  }
  doc.moveDown(0.3);
  ensureRoom(doc, 40);
  body(doc, 'Where the numbers come from', { size: 10, face: 'bold' });
  for (const s of v.sources) sourceLine(doc, s);
  body(doc, `Screening engine version ${v.engineVersion}.`, { size: 8.5, colour: STONE });

  const pages = doc.bufferedPageRange();
  for (let i = 0; i < pages.count; i++) {
    doc.switchToPage(pages.start + i);
    // Writing below the bottom margin would start a new page: lift the margin for the footer.
    doc.page.margins.bottom = 0;
    const y = doc.page.height - 36;
    write(
      doc.fontSize(8).fillColor(STONE),
      'sans',
      `${v.farmName} · ${v.verdictWord} · a first check, not an engineering design · page ${i + 1} of ${pages.count}`,
      { x: left, y },
      { width, align: 'center', lineBreak: false },
    );
  }
  doc.end();
  return done;
}
