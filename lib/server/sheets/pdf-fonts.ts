import 'server-only';
import path from 'node:path';
import * as fontkit from 'fontkit';
import type PDFDocument from 'pdfkit';

type Doc = InstanceType<typeof PDFDocument>;

/** The three voices of the sheet: running text, headings and figures. */
export type Face = 'sans' | 'bold' | 'mono';

const FONT_DIR = path.join(process.cwd(), 'fonts');
const NPM = path.join(process.cwd(), 'node_modules', '@expo-google-fonts');

// Each face is a chain: the sheet's own type first (Latin), then Noto Sans (Latin Extended for
// Welsh, Polish, Turkish, Vietnamese; Greek; Cyrillic), then Noto Sans SC (Chinese, Japanese kana,
// arrows and maths signs), Noto Sans KR (Hangul) and Noto Sans Tamil (the Tamil subset, unpacked
// from its WOFF by scripts/woff-to-ttf.mjs). A word is set in the first font that has every one of
// its letters, so a name never changes typeface halfway through.
const FILES: Record<string, string> = {
  'atkinson-400': path.join(FONT_DIR, 'atkinson-hyperlegible-latin-400-normal.ttf'),
  'atkinson-700': path.join(FONT_DIR, 'atkinson-hyperlegible-latin-700-normal.ttf'),
  'plex-mono-400': path.join(FONT_DIR, 'ibm-plex-mono-latin-400-normal.ttf'),
  'noto-400': path.join(NPM, 'noto-sans', '400Regular', 'NotoSans_400Regular.ttf'),
  'noto-700': path.join(NPM, 'noto-sans', '700Bold', 'NotoSans_700Bold.ttf'),
  'noto-sc-400': path.join(NPM, 'noto-sans-sc', '400Regular', 'NotoSansSC_400Regular.ttf'),
  'noto-sc-700': path.join(NPM, 'noto-sans-sc', '700Bold', 'NotoSansSC_700Bold.ttf'),
  'noto-kr-400': path.join(NPM, 'noto-sans-kr', '400Regular', 'NotoSansKR_400Regular.ttf'),
  'noto-kr-700': path.join(NPM, 'noto-sans-kr', '700Bold', 'NotoSansKR_700Bold.ttf'),
  'noto-tamil-400': path.join(FONT_DIR, 'noto-sans-tamil-tamil-400-normal.ttf'),
  'noto-tamil-700': path.join(FONT_DIR, 'noto-sans-tamil-tamil-700-normal.ttf'),
};

const CHAINS: Record<Face, string[]> = {
  sans: ['atkinson-400', 'noto-400', 'noto-sc-400', 'noto-kr-400', 'noto-tamil-400'],
  bold: ['atkinson-700', 'noto-700', 'noto-sc-700', 'noto-kr-700', 'noto-tamil-700'],
  mono: ['plex-mono-400', 'noto-400', 'noto-sc-400', 'noto-kr-400', 'noto-tamil-400'],
};

// What no font in the chain draws is spelled out rather than printed as an empty box.
const SPELLED: Record<string, string> = { '₂': '2', '₃': '3' };

interface Coverage {
  hasGlyphForCodePoint(cp: number): boolean;
}
const opened = new Map<string, Coverage>();

function coverage(name: string): Coverage {
  let font = opened.get(name);
  if (!font) {
    font = fontkit.openSync(FILES[name] ?? '') as unknown as Coverage;
    opened.set(name, font);
  }
  return font;
}

const covers = (name: string, text: string) => Array.from(text).every((ch) => /\s/.test(ch) || coverage(name).hasGlyphForCodePoint(ch.codePointAt(0) ?? 0));

/** Whether a name is one of the fonts registered with every document. */
export const isRegisteredFont = (name: string): boolean => name in FILES;

/** Registers every font of every chain with the document under its own name. */
export function registerFonts(doc: Doc): void {
  for (const [name, file] of Object.entries(FILES)) doc.registerFont(name, file);
}

export interface Run {
  font: string;
  text: string;
}

/** The text cut into runs, each with the first font of the face's chain that draws all of it. */
export function fontRuns(text: string, face: Face): Run[] {
  const chain = CHAINS[face];
  const runs: Run[] = [];
  const push = (font: string, part: string) => {
    const last = runs[runs.length - 1];
    if (last && last.font === font) last.text += part;
    else runs.push({ font, text: part });
  };
  for (const token of text.split(/(\s+)/)) {
    if (!token) continue;
    if (/^\s+$/.test(token)) {
      push(runs[runs.length - 1]?.font ?? chain[0] ?? '', token);
      continue;
    }
    const whole = chain.find((name) => covers(name, token));
    if (whole) {
      push(whole, token);
      continue;
    }
    for (const ch of Array.from(token)) {
      const one = chain.find((name) => covers(name, ch));
      if (one) push(one, ch);
      else push(chain[0] ?? '', SPELLED[ch] ?? '?');
    }
  }
  return runs.length ? runs : [{ font: chain[0] ?? '', text: '' }];
}

type TextOptions = PDFKit.Mixins.TextOptions;

/** Writes the text in the face (switching font where a word needs another), at (x, y) when given. */
export function write(doc: Doc, face: Face, text: string, at?: { x: number; y: number } | null, options: TextOptions = {}): Doc {
  const runs = fontRuns(text, face);
  if (runs.length > 1 && at && options.lineBreak === false) return writeLine(doc, runs, at, options);
  runs.forEach((run, i) => {
    doc.font(run.font);
    const opts = { ...options, continued: i < runs.length - 1 ? true : (options.continued ?? false) };
    if (i === 0 && at) doc.text(run.text, at.x, at.y, opts);
    else doc.text(run.text, opts);
  });
  return doc;
}

// One line of mixed fonts, placed run by run: pdfkit aligns each continued run on its own.
function writeLine(doc: Doc, runs: Run[], at: { x: number; y: number }, options: TextOptions): Doc {
  const widths = runs.map((run) => doc.font(run.font).widthOfString(run.text));
  const total = widths.reduce((a, b) => a + b, 0);
  const box = options.width ?? total;
  let x = at.x + (options.align === 'center' ? (box - total) / 2 : options.align === 'right' ? box - total : 0);
  runs.forEach((run, i) => {
    doc.font(run.font).text(run.text, x, at.y, { lineBreak: false });
    x += widths[i] ?? 0;
  });
  return doc;
}

/** The height the text takes at the current size and width (measured in the face's first font). */
export function heightOf(doc: Doc, face: Face, text: string, options: TextOptions = {}): number {
  const runs = fontRuns(text, face);
  doc.font(runs.length === 1 ? (runs[0]?.font ?? CHAINS[face][0] ?? '') : (CHAINS[face][1] ?? ''));
  return doc.heightOfString(text, options);
}
