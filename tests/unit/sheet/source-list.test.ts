import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { SourceList } from '@/app/(sheet)/sheets/[visitId]/_components/source-list';
import { buildSheetView } from '@/lib/shared/sheet/view-model';
import { brandtLikeSource } from './fixture';

// The markup's text, tags dropped and React's escapes undone.
const textOf = (html: string) =>
  html
    .replace(/<[^>]+>/g, '\n')
    .replace(/&quot;/g, '"')
    .replace(/&#x27;/g, "'")
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&amp;/g, '&');
const render = (sources: Parameters<typeof SourceList>[0]['sources']) => renderToStaticMarkup(createElement(SourceList, { sources }));

describe('the sheet page: where the numbers come from', () => {
  it("shows a linked source's name as a link that opens the document, and an unlinked one as plain text", () => {
    const html = render([
      { id: 'linked', citation: 'Iversen (1975), An analysis of the hydraulic ram', url: 'https://doi.org/10.1115/1.3447251' },
      { id: 'plain', citation: 'Engineering judgement of the trade', url: null },
    ]);
    const items = html.match(/<li>.*?<\/li>/g) ?? [];
    expect(items).toHaveLength(2);
    expect(items[0]).toMatch(
      /^<li><a href="https:\/\/doi\.org\/10\.1115\/1\.3447251" target="_blank" rel="noopener noreferrer"[^>]*>Iversen \(1975\), An analysis of the hydraulic ram/,
    );
    expect(items[1]).toBe('<li>Engineering judgement of the trade</li>');
  });

  it('links exactly the sources of a real sheet that have an address', () => {
    const view = buildSheetView(brandtLikeSource(), 'metric');
    const html = render(view.sources);
    const hrefs = [...html.matchAll(/<a href="([^"]+)"/g)].map((m) => m[1]?.replace(/&amp;/g, '&'));
    expect(hrefs).toEqual(view.sources.filter((s) => s.url).map((s) => s.url));
    const lines = textOf(html).split('\n');
    for (const s of view.sources) expect(lines).toContain(s.citation);
  });
});
