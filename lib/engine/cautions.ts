// Cautions printed on every sheet: they defer to local codes and licensed practice.
import { amount, renderMessage, say, type Message } from '@/lib/shared/display/message';
import type { Caution } from './screening-types';

export interface CautionFacts {
  /** Null for a gravity supply: no ram, no surge. */
  pressures: { workingPeakHeadM: number; blockedDeliveryHeadM: number } | null;
  anyPeople: boolean;
  deliveryLpd: number;
}

/** A caution kept as a message (rendered per reader) and as its metric text. */
function caution(code: string, text: Message | string): Caution {
  const message = typeof text === 'string' ? { template: text, amounts: [] } : text;
  return { code, text: renderMessage(message, 'metric'), message };
}

/** Safety, water quality, neighbour and permit cautions for a screening. */
export function cautionsFor(f: CautionFacts): Caution[] {
  const list: { code: string; text: Message | string }[] = [
    {
      code: 'NOT_A_DESIGN',
      text: 'This is a screening from field readings, not an engineering design. Follow local codes and have a qualified, licensed practitioner check the design before anything is bought or built.',
    },
  ];
  if (f.pressures) {
    list.push({
      code: 'SURGE_PRESSURE',
      text: say`In normal running the ram and the lower drive pipe see about ${amount('head', f.pressures.workingPeakHeadM)}; if the delivery is blocked (a shut valve, a float valve, a waterlogged air vessel) they see up to ${amount('head', f.pressures.blockedDeliveryHeadM)}. Use pipe, fittings and a ram rated for the higher figure, start the ram with the delivery open or through a relief valve, put no float valve on the delivery unless it is rated for the blocked pressure, and never stand over the waste valve while adjusting it.`,
    });
    list.push({
      code: 'NOISE',
      text: 'A ram knocks day and night, forty or more beats a minute, and the sound carries along the pipe: site it away from houses and talk to neighbours first.',
    });
  }
  list.push(
    {
      code: 'WORKING_IN_WATER',
      text:
        'Streams flood, sometimes suddenly: work in and near water only in settled weather and never alone. Keep the intake and pipes clear of flood debris; protect pipes from frost. Steel pipe is heavy; slopes are slippery.' +
        (f.pressures ? ' The ram must not sit under water; lead its waste water back to the stream.' : ''),
    },
    {
      code: 'TANK_SAFETY',
      text: 'Cover and secure the tank: an open tank can drown a child or an animal and breeds mosquitoes. Lead its overflow back to the stream or a soakaway, not across a path or a neighbour\u2019s land.',
    },
    {
      code: 'PERMITS',
      text: say`Taking water from a stream or spring may need a permit; the ${amount('litresPerDay', f.deliveryLpd)} delivered is used up${f.pressures ? ', while the waste water returns to the stream' : ''}. Rules may also ask for a minimum flow left in the stream and a screen at the intake that keeps fish out. Check local water rights before building.`,
    },
  );
  if (f.anyPeople) {
    list.push(
      {
        code: 'UNTREATED_WATER',
        text: 'This is untreated stream or spring water. Drinking water must have no E. coli in any 100 mL sample (WHO guidelines): test it, and treat or disinfect it before people drink it.',
      },
      {
        code: 'BACKFLOW',
        text: 'Where the tank feeds a house\u2019s plumbing, fit backflow protection as the local plumbing code asks, so stream water can never run back into a treated or public supply.',
      },
    );
  }
  return list.map((c) => caution(c.code, c.text));
}
