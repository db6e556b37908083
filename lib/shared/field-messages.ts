// The one mapping from a schema's issue to a sentence a person reads: the field by its form label,
// a limit in the reader's units. Schema paths and zod's codes never reach a screen. The server uses
// it in metric (so an API 4xx names the field in words); the phone in the advisor's units.
import type { UnitSystem } from './domain';
import { fieldWords } from './conflict-fields';
import { formatWhole } from './display/numbers';
import { showQuantity } from './display/quantities';

type Path = readonly PropertyKey[];

/** The parts of a zod issue the mapping reads (zod passes the same shape to error maps). */
export interface IssueLike {
  code: string;
  path?: Path;
  input?: unknown;
  origin?: string;
  expected?: string;
  minimum?: number | bigint;
  maximum?: number | bigint;
  inclusive?: boolean;
  message?: string;
  params?: Record<string, unknown>;
}

/** The last named field of a path ("measurement.trials.3.seconds" → "seconds"). */
function fieldKey(path: Path | undefined): string | undefined {
  return [...(path ?? [])].reverse().find((p): p is string => typeof p === 'string');
}

/** A plain sentence for the issue, or undefined when the schema's own message should stand. */
export function plainIssueMessage(issue: IssueLike, units: UnitSystem = 'metric'): string | undefined {
  const key = fieldKey(issue.path);
  const words = key ? fieldWords(key) : undefined;
  const label = words?.label ?? 'This value';
  const limit = (n: number | bigint | undefined) => {
    const value = Number(n);
    return words?.quantity ? showQuantity(value, words.quantity, units) : formatWhole(value);
  };
  switch (issue.code) {
    case 'invalid_type':
      if (issue.input === undefined || issue.input === null) return `${label} is needed.`;
      return issue.expected === 'number' ? `${label} must be a number.` : `${label} is not in a form the app can use.`;
    case 'too_small':
      if (issue.origin === 'array' || issue.origin === 'set') return `${label}: add at least ${Number(issue.minimum)}.`;
      if (issue.origin === 'string')
        return Number(issue.minimum) <= 1 ? `${label} is needed.` : `${label} must be at least ${Number(issue.minimum)} characters.`;
      if (Number(issue.minimum) === 0) return issue.inclusive ? `${label} must not be negative.` : `${label} must be more than 0.`;
      return `${label} must be at least ${limit(issue.minimum)}.`;
    case 'too_big':
      if (issue.origin === 'array' || issue.origin === 'set') return `${label}: at most ${Number(issue.maximum)}.`;
      if (issue.origin === 'string') return `${label} must be at most ${Number(issue.maximum)} characters.`;
      return `${label} must be at most ${limit(issue.maximum)}.`;
    case 'invalid_value':
    case 'invalid_union':
      return `Choose ${label.toLowerCase()} from the list.`;
    case 'not_multiple_of':
      return `${label} must be a whole number.`;
    case 'invalid_format':
      return `${label} is not in a form the app can use.`;
    case 'custom':
      return customMessage(issue.params, units);
    case 'unrecognized_keys':
      return 'The record carries a field the app does not know.';
    default:
      return undefined;
  }
}

/** Rules across fields that carry their figures (SI) in `params`, worded here in the reader's units. */
function customMessage(params: Record<string, unknown> | undefined, units: UnitSystem): string | undefined {
  const height = (key: string) => showQuantity(Number(params?.[key]), 'length', units);
  switch (params?.kind) {
    case 'uphill-fall':
      return `This run climbs ${height('heightM')} from the intake to the ram: a fall goes downhill. Check the order of the readings (backsight before foresight) and where you started.`;
    case 'downhill-lift':
      return `This run goes down ${height('heightM')} from the ram to the tank: the tank must stand above the ram. Check "Booked from" and the order of the readings.`;
    case 'fall-too-high':
      return `A fall of ${height('heightM')} is more than any ram uses (at most ${height('maxM')}). Check each reading for a slipped decimal point.`;
    case 'lift-too-high':
      return `A lift of ${height('heightM')} is more than any ram reaches (at most ${height('maxM')}). Check each reading for a slipped decimal point.`;
    default:
      return undefined;
  }
}

/** True for zod's own default wording (which must not reach a person). */
export function isSchemaText(message: string): boolean {
  return /^(Invalid input|Too (big|small)|Invalid (option|string|element|key)|Unrecognized key)|expected .*, received|expected .* to be/.test(message);
}

/**
 * Issues as one message per path ("measurement.trials.3.seconds" → "Seconds must be more than 0."),
 * the first per path, with any default zod text replaced by a plain sentence.
 */
export function messagesByPath(issues: readonly IssueLike[], units: UnitSystem = 'metric'): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of issues) {
    const key = (issue.path ?? []).map(String).join('.');
    if (key in out) continue;
    const own = issue.message && !isSchemaText(issue.message) ? issue.message : undefined;
    out[key] = own ?? plainIssueMessage(issue, units) ?? 'This value cannot be used.';
  }
  return out;
}
