import { EngineInputError } from './errors';
import type { SourceId } from './sources';
import { nonNegative } from './validate';

export type DemandKind =
  | 'person-basic'
  | 'person-tap-on-plot'
  | 'person-emergency'
  | 'beef-cow-nursing'
  | 'beef-cow-dry'
  | 'bull'
  | 'growing-cattle'
  | 'finishing-cattle'
  | 'dairy-cow-lactating'
  | 'dairy-cow-dry'
  | 'horse'
  | 'sheep'
  | 'goat'
  | 'sow-lactating'
  | 'chicken'
  | 'laying-hen'
  | 'garden-m2';

export interface DemandEntry {
  kind: DemandKind;
  label: string;
  /** Default daily figure per head (per m² for gardens), L; hot-weather values where the source gives them. */
  litresPerHeadPerDay: number;
  unit: 'head' | 'person' | 'bird' | 'm²';
  sourceId: SourceId;
  basis: string;
}

const GAL = 3.785411784;

// Per-head daily figures; the organisation may override any of them (settings.demandOverrides).
export const DEMAND_CATALOGUE: Readonly<Record<DemandKind, DemandEntry>> = {
  'person-basic': {
    kind: 'person-basic',
    label: 'Person, basic access',
    litresPerHeadPerDay: 20,
    unit: 'person',
    sourceId: 'who-howard-bartram-2003',
    basis: 'WHO basic access ~20 L/person/day',
  },
  'person-tap-on-plot': {
    kind: 'person-tap-on-plot',
    label: 'Person, tap on the plot',
    litresPerHeadPerDay: 50,
    unit: 'person',
    sourceId: 'who-howard-bartram-2003',
    basis: 'WHO intermediate access ~50 L/person/day',
  },
  'person-emergency': {
    kind: 'person-emergency',
    label: 'Person, emergency minimum',
    litresPerHeadPerDay: 15,
    unit: 'person',
    sourceId: 'sphere-2018',
    basis: 'Sphere minimum 15 L/person/day',
  },
  'beef-cow-nursing': {
    kind: 'beef-cow-nursing',
    label: 'Beef cow with calf',
    litresPerHeadPerDay: round(16.5 * GAL),
    unit: 'head',
    sourceId: 'ndsu-as954',
    basis: '16.5 gal at 88 °F',
  },
  'beef-cow-dry': {
    kind: 'beef-cow-dry',
    label: 'Beef cow, dry',
    litresPerHeadPerDay: round(14 * GAL),
    unit: 'head',
    sourceId: 'ndsu-as954',
    basis: '14 gal at 88 °F',
  },
  bull: { kind: 'bull', label: 'Bull', litresPerHeadPerDay: round(18 * GAL), unit: 'head', sourceId: 'ndsu-as954', basis: '18 gal at 88 °F' },
  'growing-cattle': {
    kind: 'growing-cattle',
    label: 'Growing cattle (600 lb)',
    litresPerHeadPerDay: round(12 * GAL),
    unit: 'head',
    sourceId: 'ndsu-as954',
    basis: '12 gal at 88 °F',
  },
  'finishing-cattle': {
    kind: 'finishing-cattle',
    label: 'Finishing cattle (1,000 lb)',
    litresPerHeadPerDay: round(20 * GAL),
    unit: 'head',
    sourceId: 'ndsu-as954',
    basis: '20 gal at 88 °F',
  },
  'dairy-cow-lactating': {
    kind: 'dairy-cow-lactating',
    label: 'Dairy cow, milking',
    litresPerHeadPerDay: round(30 * GAL),
    unit: 'head',
    sourceId: 'kstate-lwh',
    basis: 'top of 15–30 gal',
  },
  'dairy-cow-dry': {
    kind: 'dairy-cow-dry',
    label: 'Dairy cow, dry',
    litresPerHeadPerDay: round(17.3 * GAL),
    unit: 'head',
    sourceId: 'ndsu-as954',
    basis: '17.3 gal (1,700 lb) at 80 °F',
  },
  horse: { kind: 'horse', label: 'Horse', litresPerHeadPerDay: round(10 * GAL), unit: 'head', sourceId: 'kstate-lwh', basis: '≥ 1 gal per 100 lb, ~10 gal' },
  sheep: { kind: 'sheep', label: 'Sheep', litresPerHeadPerDay: round(2 * GAL), unit: 'head', sourceId: 'hindawi-2017', basis: '2 gal' },
  goat: { kind: 'goat', label: 'Goat', litresPerHeadPerDay: round(2 * GAL), unit: 'head', sourceId: 'hindawi-2017', basis: '2 gal' },
  'sow-lactating': { kind: 'sow-lactating', label: 'Sow, nursing', litresPerHeadPerDay: 23, unit: 'head', sourceId: 'older-us-table', basis: '40–50 lb/day' },
  chicken: {
    kind: 'chicken',
    label: 'Chicken',
    litresPerHeadPerDay: round((12 * GAL) / 100),
    unit: 'bird',
    sourceId: 'hindawi-2017',
    basis: '6–12 gal per 100 birds (top)',
  },
  'laying-hen': {
    kind: 'laying-hen',
    label: 'Laying hen',
    litresPerHeadPerDay: round((9 * GAL) / 100),
    unit: 'bird',
    sourceId: 'older-us-table',
    basis: '9 gal per 100 at 90 °F',
  },
  'garden-m2': { kind: 'garden-m2', label: 'Garden, per m²', litresPerHeadPerDay: 5, unit: 'm²', sourceId: 'fao-56', basis: 'mid of 3–7 mm/day' },
};

function round(litres: number): number {
  return Math.round(litres * 100) / 100;
}

export interface DemandLine {
  kind: DemandKind;
  count: number;
  litresPerHeadPerDay?: number;
}

export interface DemandLineResult {
  kind: DemandKind;
  count: number;
  litresPerHeadPerDay: number;
  dailyL: number;
  /** 'line' when the visit gave its own figure, 'organisation' for an override, else the catalogue source. */
  figureFrom: 'line' | 'organisation' | 'catalogue';
  sourceId: SourceId;
}

/** Each demand line with the figure it used and where that figure came from. */
export function demandBreakdown(lines: readonly DemandLine[], overrides: Partial<Record<DemandKind, number>> = {}): DemandLineResult[] {
  if (!Array.isArray(lines as unknown)) throw new EngineInputError('lines', 'must be a list');
  return lines.map((line, i) => {
    const entry = DEMAND_CATALOGUE[line?.kind];
    if (!entry) throw new EngineInputError(`lines.${i}.kind`, 'is not a known demand kind');
    const count = nonNegative(line.count, `lines.${i}.count`);
    const own = line.litresPerHeadPerDay;
    const override = overrides[line.kind];
    const perHead = own ?? override ?? entry.litresPerHeadPerDay;
    nonNegative(perHead, own !== undefined ? `lines.${i}.litresPerHeadPerDay` : `overrides.${line.kind}`);
    return {
      kind: line.kind,
      count,
      litresPerHeadPerDay: perHead,
      dailyL: count * perHead,
      figureFrom: own !== undefined ? 'line' : override !== undefined ? 'organisation' : 'catalogue',
      sourceId: own !== undefined || override !== undefined ? 'common-practice' : entry.sourceId,
    };
  });
}

/** Total daily demand, L/day: Σ count × per-head figure (catalogue default when a line gives none). */
export function dailyDemandL(lines: readonly DemandLine[], overrides: Partial<Record<DemandKind, number>> = {}): number {
  return demandBreakdown(lines, overrides).reduce((sum, l) => sum + l.dailyL, 0);
}
