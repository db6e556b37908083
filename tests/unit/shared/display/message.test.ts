import { describe, expect, it } from 'vitest';
import { amount, renderMessage, say } from '@/lib/shared/display/message';
import { screenSite } from '@/lib/engine';
import { sentence } from '@/lib/shared/sheet/sentence';
import * as sites from '../../engine/fixtures/demo-sites';

describe('sentences with figures, for each reader', () => {
  it('renders each amount in the reader units', () => {
    const m = say`The ram would deliver ${amount('litresPerDay', 719)} against a demand of ${amount('litresPerDay', 753)}.`;
    expect(renderMessage(m, 'metric')).toBe('The ram would deliver 719 L/day against a demand of 753 L/day.');
    expect(renderMessage(m, 'us')).toBe('The ram would deliver 190 gal/day against a demand of 199 gal/day.');
  });

  it('keeps words and trade sizes as written: a 1″ (25 mm) pipe stays one inch', () => {
    const m = say`Use a ${'1″ (25 mm)'} pipe over ${amount('length', 50)} and a ${amount('volume', 2000)} tank; ${amount('percent', 0.5)} of the flow.`;
    expect(renderMessage(m, 'us')).toBe('Use a 1″ (25 mm) pipe over 164 ft and a 528 gal tank; 50 % of the flow.');
    expect(renderMessage(m, 'metric')).toBe('Use a 1″ (25 mm) pipe over 50.0 m and a 2,000 L tank; 50 % of the flow.');
  });

  it('joins a message within a message with its figures in order', () => {
    const inner = say`rated to ${amount('length', 60)}`;
    const outer = say`About ${amount('head', 45)}, more than the pipe ${inner} holds.`;
    expect(outer.amounts).toHaveLength(2);
    expect(renderMessage(outer, 'us')).toBe('About 148 ft of head (64.0 psi), more than the pipe rated to 197 ft holds.');
  });

  it('the engine sentences carry their figures: a US reader sees no metric unit in them', () => {
    const said = Object.values(sites).flatMap((site) => {
      const screening = screenSite({ ...site, monteCarlo: { samples: 200, seed: 1 } });
      return [
        ...screening.reasons,
        ...screening.conditions,
        ...screening.cautions,
        ...screening.billOfMaterials.flatMap((l) =>
          [l.noteMessage, l.sizeMessage].filter((m) => m !== undefined).map((m) => ({ code: l.item, message: m, text: renderMessage(m, 'metric') })),
        ),
      ];
    });
    expect(said.filter((s) => s.message && s.message.amounts.length > 0).length).toBeGreaterThan(20);
    for (const s of said) {
      expect(s.message, s.code).toBeDefined();
      expect(renderMessage(s.message!, 'metric')).toBe(s.text);
      const us = sentence(s, 'us');
      expect(us, s.code).not.toMatch(/\d (m|mm|L|L\/day|L\/min|kPa)\b(?!²)/);
    }
  });
});
