// The phone's refusal of a save, apart from the checks themselves (which load on first use), so a
// screen can tell a refusal from a failure without loading the schemas.
import type { Unusual } from '@/lib/shared/plausibility';

/**
 * A save the phone refuses, as the server would: `messages` by field path (plain words, the advisor's
 * units), and unusual values still to be confirmed. Nothing was written.
 */
export class RecordRefused extends Error {
  constructor(
    readonly messages: Record<string, string>,
    readonly unusual: Unusual[],
  ) {
    super(Object.values(messages)[0] ?? unusual[0]?.message ?? 'This record cannot be saved.');
    this.name = 'RecordRefused';
  }
}
