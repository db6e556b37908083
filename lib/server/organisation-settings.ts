import 'server-only';
import type { OrganisationSettings } from '@/models';

/** A new organisation's settings: metric, half of the lowest flow, catalogue demand figures. */
export function defaultOrganisationSettings(): OrganisationSettings {
  return {
    unitsDefault: 'metric',
    // 0.5 × the lowest measured flow: low end of the 0.5–0.8 band (common practice, no source).
    designFractionOfLowest: 0.5,
    demandFigures: {},
    pipePrices: [],
  };
}
