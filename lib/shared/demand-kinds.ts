// Demand kinds by name: a name a person sent is a kind only when the catalogue has it as its own
// key (`'constructor' in DEMAND_CATALOGUE` is true for every object).
import { DEMAND_CATALOGUE, type DemandKind } from '@/lib/engine/demand';

export const isDemandKind = (key: string): key is DemandKind => Object.hasOwn(DEMAND_CATALOGUE, key);

/** The per-head figures whose names are demand kinds; anything else (stored before this check) is left out. */
export function knownDemandFigures(figures: Record<string, number> | null | undefined): Partial<Record<DemandKind, number>> {
  return Object.fromEntries(Object.entries(figures ?? {}).filter(([key]) => isDemandKind(key)));
}
