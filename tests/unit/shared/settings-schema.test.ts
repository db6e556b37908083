import { describe, expect, it } from 'vitest';
import { DEMAND_CATALOGUE } from '@/lib/engine/demand';
import { settingsSchema } from '@/lib/shared/schemas/office';

const base = { unitsDefault: 'metric', designFractionOfLowest: '0.5', pipePrices: [] };

describe('settings: per-head figures', () => {
  it('drops blank boxes (the catalogue figure is used) and keeps the figures given', () => {
    const parsed = settingsSchema.safeParse({ ...base, demandFigures: { sheep: '', goat: '  ', bull: '45', horse: null, chicken: undefined } });
    expect(parsed.success).toBe(true);
    expect(parsed.data?.demandFigures).toEqual({ bull: 45 });
  });

  it('saves with every box blank', () => {
    const parsed = settingsSchema.safeParse({ ...base, demandFigures: Object.fromEntries(Object.keys(DEMAND_CATALOGUE).map((k) => [k, ''])) });
    expect(parsed.success).toBe(true);
    expect(Object.keys(DEMAND_CATALOGUE)).toHaveLength(17);
    expect(parsed.data?.demandFigures).toEqual({});
  });

  it('refuses names every object inherits as kinds, even when blank', () => {
    for (const kind of ['constructor', 'toString', '__proto__']) {
      const parsed = settingsSchema.safeParse({ ...base, demandFigures: JSON.parse(`{"${kind}": "5", "sheep": ""}`) });
      expect(parsed.success).toBe(false);
      expect(parsed.error?.issues.map((i) => [i.path.join('.'), i.message])).toContainEqual([`demandFigures.${kind}`, 'Not a demand kind the screen knows.']);
    }
  });

  it('still refuses a figure that is not a positive number, naming the box', () => {
    const parsed = settingsSchema.safeParse({ ...base, demandFigures: { sheep: 'lots', goat: '-2' } });
    expect(parsed.success).toBe(false);
    const issues = parsed.error?.issues.map((i) => [i.path.join('.'), i.message]);
    expect(issues).toContainEqual(['demandFigures.sheep', 'A per-head figure must be a number.']);
    expect(issues).toContainEqual(['demandFigures.goat', 'A per-head figure must be more than 0.']);
  });
});

describe('settings: least chance of meeting the need for a plain go', () => {
  it('defaults to 0.8 when blank or left out, and takes a comma decimal', () => {
    expect(settingsSchema.parse({ ...base, demandFigures: {} }).minProbabilityForGo).toBe(0.8);
    expect(settingsSchema.parse({ ...base, demandFigures: {}, minProbabilityForGo: '' }).minProbabilityForGo).toBe(0.8);
    expect(settingsSchema.parse({ ...base, demandFigures: {}, minProbabilityForGo: '0,9' }).minProbabilityForGo).toBe(0.9);
  });
  it('refuses a chance a coin toss would meet, naming the box', () => {
    const parsed = settingsSchema.safeParse({ ...base, demandFigures: {}, minProbabilityForGo: '0.3' });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues[0]?.path).toEqual(['minProbabilityForGo']);
  });
});
