import { VERDICT_COLOURS as COLOURS, VERDICT_WORDS as WORDS, type Verdict } from '@/lib/shared/domain';

// The verdict vial of verdict-mark.tsx as an SVG string, for map markers (Leaflet divIcons take HTML).
export const VERDICT_COLOURS: Record<Verdict | 'none', string> = { ...COLOURS, none: '#4F555A' };
export const VERDICT_WORDS: Record<Verdict | 'none', string> = { ...WORDS, none: 'Not screened yet' };

/** The vial's inner mark: bubble centred (go), off to one side (conditional), struck through (no-go), a running-water wave along it (gravity), empty (not screened). */
export function verdictInnerSvg(verdict: Verdict | 'none', colour: string): string {
  if (verdict === 'no-go') return `<line x1="4" y1="26" x2="44" y2="2" stroke="${colour}" stroke-width="3.5" stroke-linecap="round"/>`;
  if (verdict === 'gravity')
    return `<path d="M6 14 Q12 8 18 14 Q24 20 30 14 Q36 8 42 14" fill="none" stroke="${colour}" stroke-width="3" stroke-linecap="round"/>`;
  if (verdict === 'none') return '';
  return `<ellipse cx="${verdict === 'go' ? 24 : 36}" cy="14" rx="5" ry="4" fill="${colour}"/>`;
}

/** The vial on a white pill, as an SVG string. */
export function verdictSvg(verdict: Verdict | 'none', width = 40): string {
  const c = VERDICT_COLOURS[verdict];
  const h = Math.round((width * 28) / 48);
  const dash = verdict === 'none' ? ' stroke-dasharray="4 3"' : '';
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${h}" viewBox="0 0 48 28" aria-hidden="true">` +
    `<rect x="1" y="4" width="46" height="20" rx="10" fill="#fff"/>` +
    `<rect x="2" y="6" width="44" height="16" rx="8" fill="none" stroke="${c}" stroke-width="2.5"${dash}/>` +
    `<line x1="18" y1="6" x2="18" y2="22" stroke="${c}" stroke-width="2"/><line x1="30" y1="6" x2="30" y2="22" stroke="${c}" stroke-width="2"/>` +
    `${verdictInnerSvg(verdict, c)}</svg>`
  );
}
