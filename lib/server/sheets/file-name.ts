// The PDF's download name keeps the farm's own spelling (RFC 6266 / RFC 8187 `filename*` in UTF-8)
// with a plain ASCII `filename` for clients that read only that.

const slug = (text: string) =>
  text
    .toLowerCase()
    .replace(/[^\p{L}\p{M}\p{N}]+/gu, '-')
    .replace(/^-|-$/g, '');

/** "Tŷ Gwyn" → "fallbook-sheet-tŷ-gwyn.pdf": the name as the farm spells it. */
export function sheetFileName(farmName: string): string {
  return `fallbook-sheet-${slug(farmName) || 'farm'}.pdf`;
}

/** The Content-Disposition value for the sheet's PDF download. */
export function sheetContentDisposition(farmName: string): string {
  const unicode = sheetFileName(farmName);
  // ASCII fallback: letters stripped of their accents, anything else dropped.
  const ascii = `fallbook-sheet-${
    farmName
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .replace(/[łŁ]/g, 'l')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '') || 'farm'
  }.pdf`;
  const encoded = encodeURIComponent(unicode).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}
