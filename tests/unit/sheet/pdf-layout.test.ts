import { describe, expect, it } from 'vitest';
import { PDFParse } from 'pdf-parse';
import { renderSheetPdf, type Paper } from '@/lib/server/sheets/pdf';
import { buildSheetView, type SheetView } from '@/lib/shared/sheet/view-model';
import { brandtLikeSource, gravitySource } from './fixture';

async function pagesOf(view: SheetView, paper: Paper): Promise<string[]> {
  const parser = new PDFParse({ data: new Uint8Array(await renderSheetPdf(view, paper)) });
  try {
    return (await parser.getText()).pages.map((p) => p.text.replace(/[ \t]+/g, ' '));
  } finally {
    await parser.destroy();
  }
}

const HEADINGS = [
  'Key figures',
  'The water path, from intake to tank',
  'Where the points are',
  'Conditions for a go',
  'Bill of materials',
  'Ten years: a ram, a solar pump or a petrol pump',
  'Cautions',
  'How we worked this out',
];

// What a page says after a heading, without the footer line (the last line on every page).
function after(page: string, heading: string): string {
  const lines = page
    .split('\n')
    .map((l) => l.trim())
    .filter(Boolean);
  const at = lines.findIndex((l) => l.startsWith(heading));
  return lines.slice(at + 1, -1).join(' ');
}

describe('PDF layout on A4 and US Letter', () => {
  for (const paper of ['a4', 'letter'] as const) {
    for (const units of ['metric', 'us'] as const) {
      it(`${paper}, ${units}: page 1 holds the verdict, the key figures and the drawing`, async () => {
        const pages = await pagesOf(buildSheetView(brandtLikeSource(), units), paper);
        expect(pages[0]).toContain('Go');
        expect(pages[0]).toContain('Key figures');
        expect(pages[0]).toContain('The water path, from intake to tank');
        // Six pages at most: the bill lists the ram's own parts line by line, each with its basis and price, then
        // the ten-year comparison with its assumptions.
        expect(pages.length).toBeLessThanOrEqual(6);
      });

      it(`${paper}, ${units}: no heading ends a page; the bill's heading sits with its column headings and first row`, async () => {
        const view = buildSheetView(brandtLikeSource(), units);
        const pages = await pagesOf(view, paper);
        for (const heading of HEADINGS) {
          const page = pages.find((p) => p.split('\n').some((l) => l.trim().startsWith(heading)));
          expect(page, heading).toBeDefined();
          expect(after(page ?? '', heading).length, heading).toBeGreaterThan(20);
        }
        const bill = pages.find((p) => p.includes('Bill of materials')) ?? '';
        expect(after(bill, 'Bill of materials')).toMatch(/^Item Size Quantity Basis Price/);
        expect(after(bill, 'Bill of materials')).toContain(view.billOfMaterials[0]?.item ?? '?');
      });
    }

    it(`${paper}: says each figure plainly: sources in words, chance as a likelihood, no raw source ids`, async () => {
      const view = buildSheetView(brandtLikeSource(), 'metric');
      const text = (await pagesOf(view, paper)).join('\n').replace(/\s+/g, ' ');
      expect(text).toContain('Where the numbers come from');
      for (const s of view.sources) expect(text).not.toContain(s.id);
      expect(text).not.toMatch(/over 99 %/);
      expect(text).toMatch(/likely \(about \d+ in 100\)/i);
      expect(text).toContain('a season drier than the one measured is not covered');
    });

    it(`${paper}: a bill running onto a new page repeats its column headings there`, async () => {
      const view = buildSheetView(brandtLikeSource(), 'metric');
      const line = view.billOfMaterials[0];
      if (!line) throw new Error('the fixture has a bill');
      view.billOfMaterials = Array.from({ length: 40 }, (_, i) => ({ ...line, item: `Part number ${i + 1}` }));
      const pages = await pagesOf(view, paper);
      const withRows = pages.filter((p) => /Part number \d+/.test(p));
      expect(withRows.length).toBeGreaterThan(1);
      for (const page of withRows) {
        const lines = page.split('\n').map((l) => l.trim());
        const head = lines.findIndex((l) => l.startsWith('Item Size Quantity Basis Price'));
        const firstRow = lines.findIndex((l) => /Part number \d+/.test(l));
        expect(head).toBeGreaterThanOrEqual(0);
        expect(head).toBeLessThan(firstRow);
      }
    });
  }

  it('a gravity sheet ("No pump needed") keeps every heading with what follows, on A4 and Letter', async () => {
    const view = buildSheetView(gravitySource(), 'metric');
    expect(view.verdict).toBe('gravity');
    for (const paper of ['a4', 'letter'] as const) {
      const pages = await pagesOf(view, paper);
      expect(pages[0]).toContain('No pump needed');
      for (const heading of ['Key figures', 'What to check', 'Bill of materials', 'Cautions', 'How we worked this out']) {
        const page = pages.find((p) => p.split('\n').some((l) => l.trim().startsWith(heading))) ?? '';
        expect(after(page, heading).length, `${paper}: ${heading}`).toBeGreaterThan(20);
      }
    }
  });
});

describe('the PDF costs', () => {
  it('a pumped sheet prints the priced bill with its total and the ten-year table; a gravity sheet has no comparison', async () => {
    const pumped = (await pagesOf(buildSheetView(brandtLikeSource(), 'metric'), 'a4')).join('\n').replace(/\s+/g, ' ');
    expect(pumped).toMatch(/Total £[\d,]+/);
    expect(pumped).toContain('Small solar pump with panels');
    expect(pumped).toContain('What these figures assume');
    const gravity = (await pagesOf(buildSheetView(gravitySource(), 'metric'), 'a4')).join('\n');
    expect(gravity).not.toContain('Ten years: a ram');
  });
});

describe('the PDF ten-year table', () => {
  it.each(['a4', 'letter'] as const)('%s: the three options print on one page with the heading', async (paper) => {
    for (const units of ['metric', 'us'] as const) {
      const pages = await pagesOf(buildSheetView(brandtLikeSource(), units), paper);
      const page = pages.find((p) => p.includes('Ten years: a ram')) ?? '';
      for (const option of ['Ram (this design)', 'Small solar pump with panels', 'Petrol pump']) expect(page, `${units}: ${option}`).toContain(option);
    }
  });
});

describe('the PDF sources', () => {
  // Every link annotation in the PDF, with the text it lies over.
  async function linksOf(view: SheetView): Promise<{ text: string; url: string }[]> {
    const parser = new PDFParse({ data: new Uint8Array(await renderSheetPdf(view, 'a4')) });
    try {
      return (await parser.getInfo({ parsePageInfo: true })).pages.flatMap((p) => p.links);
    } finally {
      await parser.destroy();
    }
  }

  it("makes a linked source's name a link to its document and leaves an unlinked one plain; the words stay the same", async () => {
    const view = buildSheetView(brandtLikeSource(), 'metric');
    view.sources = [
      { id: 'linked', citation: 'Iversen (1975), An analysis of the hydraulic ram', url: 'https://doi.org/10.1115/1.3447251' },
      { id: 'plain', citation: 'Engineering judgement of the trade', url: null },
    ];
    const links = await linksOf(view);
    expect(links).toHaveLength(1);
    expect(links[0]?.url).toBe('https://doi.org/10.1115/1.3447251');
    expect(links[0]?.text.replace(/\s+/g, ' ')).toContain('Iversen (1975)');
    expect(links[0]?.text).not.toContain('Engineering judgement');
    const text = (await pagesOf(view, 'a4')).join('\n').replace(/\s+/g, ' ');
    expect(text).toContain('• Iversen (1975), An analysis of the hydraulic ram');
    expect(text).toContain('• Engineering judgement of the trade');
  });

  it('links every source of a real sheet that the registry gives an address, and no other', async () => {
    const view = buildSheetView(brandtLikeSource(), 'metric');
    const withUrl = view.sources.filter((s) => s.url);
    expect(withUrl.length).toBeGreaterThan(0);
    const urls = (await linksOf(view)).map((l) => l.url);
    expect([...new Set(urls)].sort()).toEqual(withUrl.map((s) => s.url).sort());
  });
});
