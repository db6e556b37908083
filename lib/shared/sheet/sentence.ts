// The engine's sentences for one reader, on the sheet and on the phone's preview alike.
import type { Said } from '@/lib/engine/screening-types';
import type { UnitSystem } from '../domain';
import { renderMessage } from '../display/message';
import { plainTrade } from './trade-words';

/**
 * One of the engine's sentences for this reader: its message in the reader's units, trade names in the
 * reader's terms. A screening stored before sentences carried their figures has only its metric text.
 */
export function sentence(said: Said, units: UnitSystem): string {
  return plainTrade(said.message ? renderMessage(said.message, units) : said.text, units);
}
