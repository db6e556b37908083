import 'server-only';
import type { OrganisationSettings } from '@/models';
import { DEFAULT_PRICE_LIST } from '@/lib/shared/costs/price-list';

/** A new organisation's settings: metric, half of the lowest flow, catalogue demand figures. */
export function defaultOrganisationSettings(): OrganisationSettings {
  return {
    unitsDefault: 'metric',
    // 0.5 × the lowest measured flow: low end of the 0.5–0.8 band (common practice, no source).
    designFractionOfLowest: 0.5,
    // A plain go needs at least a 0.8 chance of meeting the demand (common practice, no source).
    minProbabilityForGo: 0.8,
    demandFigures: {},
    pipePrices: [],
    priceList: { ...DEFAULT_PRICE_LIST },
  };
}
