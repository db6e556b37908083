// Cautions printed on every sheet: they defer to local codes and licensed practice.
import { fmt } from './format';
import { headToKPa } from './heads';
import type { Caution } from './screening-types';

export interface CautionFacts {
  peakPressureHeadM: number | null;
  anyPeople: boolean;
  deliveryLpd: number;
}

/** Safety, water quality and permit cautions for a screening. */
export function cautionsFor(f: CautionFacts): Caution[] {
  const list: Caution[] = [
    {
      code: 'NOT_A_DESIGN',
      text: 'This is a screening from field readings, not an engineering design. Follow local codes and have a qualified, licensed practitioner check the design before anything is bought or built.',
    },
    {
      code: 'SURGE_PRESSURE',
      text:
        (f.peakPressureHeadM !== null
          ? `The ram and the lower drive pipe see pressure surges; lift plus surge may reach about ${fmt(f.peakPressureHeadM, 'm')} of head (${fmt(headToKPa(f.peakPressureHeadM), 'kPa')}). `
          : 'The ram and the lower drive pipe see pressure surges. ') +
        'Use pressure-rated pipe and fittings, fit a valve on the delivery for starting, and never stand over the waste valve while adjusting it.',
    },
    {
      code: 'WORKING_IN_WATER',
      text: 'Streams flood, sometimes suddenly: work in and near water only in settled weather and never alone. The ram must not sit under water; lead its waste water away. Steel pipe is heavy; slopes are slippery. Protect the ram and pipes from frost.',
    },
    {
      code: 'PERMITS',
      text: `Taking water from a stream or spring may need a permit; the ${fmt(f.deliveryLpd, 'L/day')} delivered is used up, while the waste water returns to the stream. Check local water rights before building.`,
    },
  ];
  if (f.anyPeople) {
    list.push({
      code: 'UNTREATED_WATER',
      text: 'Ram water is untreated stream or spring water. Drinking water must have no E. coli in any 100 mL sample (WHO guidelines): test it, and treat or disinfect it before people drink it.',
    });
  }
  return list;
}
