import { describe, expect, it } from 'vitest';
import { PDFParse } from 'pdf-parse';
import { sheetContentDisposition, sheetFileName } from '@/lib/server/sheets/file-name';
import { renderSheetPdf } from '@/lib/server/sheets/pdf';
import { buildSheetView } from '@/lib/shared/sheet/view-model';
import { brandtLikeSource } from './fixture';

// Names the district's farms really carry: Welsh, Polish, Turkish, Vietnamese, Greek, Chinese, Japanese,
// Korean, Tamil.
const HARD_NAMES = [
  'Tŷ Gwyn, Llŵyn-y-Ŵyn',
  'Żółć Łąka, Gęślą',
  'Çiftlik Ağıl Şişli',
  'Nông trại Đồng Xuân',
  'Ρέμα Αγίου',
  '王家牧场',
  '山田の農場',
  '김씨네 목장',
  'முருகன் தோட்டம்',
];

const TAMIL = /[\u0B80-\u0BFF]/;
const tamilLetters = (text: string) =>
  Array.from(text.normalize('NFD'))
    .filter((ch) => TAMIL.test(ch))
    .sort();

async function textOf(pdf: Buffer): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    return (await parser.getText()).text;
  } finally {
    await parser.destroy();
  }
}

describe('the PDF prints every name', () => {
  it('draws each hard name with real glyphs (a missing glyph reads back as U+0000 or "?")', async () => {
    const source = brandtLikeSource();
    source.farm = { name: HARD_NAMES[0] ?? '', area: HARD_NAMES.slice(1, 5).join(' · '), ownerName: HARD_NAMES.slice(5).join(' / ') };
    // The map's labels go through the drawing's SVG: a mixed-script label there too.
    source.points = source.points.map((p) => (p.role === 'tank' ? { ...p, label: 'Ŵyn 王家' } : p));
    const view = buildSheetView(source, 'metric');
    const text = (await textOf(await renderSheetPdf(view, 'a4'))).replace(/\s+/g, ' ');
    for (const name of [...HARD_NAMES.filter((n) => !TAMIL.test(n)), 'Ŵyn 王家']) expect(text).toContain(name);
    // Tamil's two-part vowels are drawn on both sides of their consonant, so the text reads back in
    // drawing order: the same letters (decomposed), not the same sequence.
    expect(tamilLetters(text)).toEqual(tamilLetters(HARD_NAMES.filter((n) => TAMIL.test(n)).join(' ')));
    expect(tamilLetters(text).length).toBeGreaterThan(10);
    expect(text).not.toContain('\u0000');
    expect(text).not.toMatch(/\?/);
  });

  it('prints the Greek and maths signs of the method notes as written', async () => {
    const view = buildSheetView(brandtLikeSource(), 'metric');
    view.method = [...view.method, 'Surge — ρ · a · Δv; flow ≥ 2 L/min, about ≈ 3 m → tank; √(2gh).'];
    const text = await textOf(await renderSheetPdf(view, 'letter'));
    for (const sign of ['ρ', 'Δ', '≥', '≈', '→', '√']) expect(text).toContain(sign);
  });
});

describe('the download name', () => {
  it('keeps the farm name in filename* (UTF-8) with an ASCII filename beside it', () => {
    const value = sheetContentDisposition('Tŷ Gwyn, Llŵyn-y-Ŵyn');
    expect(value).toContain('filename="fallbook-sheet-ty-gwyn-llwyn-y-wyn.pdf"');
    const star = /filename\*=UTF-8''(\S+)$/.exec(value)?.[1] ?? '';
    expect(decodeURIComponent(star)).toBe('fallbook-sheet-tŷ-gwyn-llŵyn-y-ŵyn.pdf');
    expect(decodeURIComponent(/filename\*=UTF-8''(\S+)$/.exec(sheetContentDisposition('王家牧场'))?.[1] ?? '')).toBe('fallbook-sheet-王家牧场.pdf');
    expect(sheetContentDisposition('王家牧场')).toContain('filename="fallbook-sheet-farm.pdf"');
    expect(sheetFileName('Żółć "Łąka"')).toBe('fallbook-sheet-żółć-łąka.pdf');
  });
});
