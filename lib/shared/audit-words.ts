// The visit's history in plain words: each stored audit line (entity, action, changes) becomes a
// sentence saying what changed. Old lines keep their stored shapes, so each shape is read here.
import { VERDICT_WORDS as VERDICTS, VISIT_STATUS_LABELS, type Verdict, type VisitStatus } from './domain';
import { formatDay } from './display/dates';
import { formatBytes } from './display/numbers';
import { showQuantity } from './display/quantities';

export interface AuditFacts {
  entity: string;
  action: string;
  changes: unknown;
}
export interface AuditWords {
  title: string;
  detail: string;
}

type Json = Record<string, unknown>;

/** What a synced record is, in words, with the name or figure that tells it apart. */
const RECORDS: Record<string, { a: string; name?: (c: Json) => string | null }> = {
  visit: { a: 'the visit’s notes or state' },
  waterSource: { a: 'a water source', name: (c) => str(c.name) },
  flowMeasurement: { a: 'a flow measurement' },
  fallReading: { a: 'a levelling run', name: (c) => (c.purpose === 'lift' ? 'lift' : c.purpose === 'fall' ? 'fall' : null) },
  point: { a: 'a point on the map', name: (c) => [str(c.label), POINT_ROLES[String(c.role)] ?? null].filter(Boolean).join(', ') || null },
  photo: { a: 'a photo', name: (c) => str(c.caption) },
  demandLine: { a: 'a water need', name: (c) => (typeof c.count === 'number' && c.kind ? `${c.count} × ${String(c.kind).replace(/-/g, ' ')}` : null) },
  pipeRun: { a: 'a pipe run', name: (c) => (c.purpose ? `${String(c.purpose)} pipe${typeof c.lengthM === 'number' ? `, ${c.lengthM} m` : ''}` : null) },
};
const POINT_ROLES: Record<string, string> = {
  intake: 'intake',
  pump: 'ram site',
  tank: 'tank',
  station: 'creek-profile station',
  source: 'source',
  other: 'other point',
};

const str = (v: unknown): string | null => (typeof v === 'string' && v.trim() ? v.trim() : null);
const state = (v: unknown): string => VISIT_STATUS_LABELS[v as VisitStatus] ?? 'an unknown state';
const quote = (v: unknown, max = 160): string => {
  const s = str(v);
  return s ? `“${s.length > max ? `${s.slice(0, max)}…` : s}”` : '';
};
const field = (name: string): string =>
  (
    ({
      notes: 'notes',
      status: 'state',
      visitedAt: 'visit time',
      lengthM: 'length',
      diameterMm: 'diameter',
      label: 'label',
      caption: 'caption',
      count: 'number',
      lat: 'position',
      lon: 'position',
      measurement: 'trials',
      run: 'readings',
      material: 'material',
    }) as Record<string, string>
  )[name] ?? name.replace(/([A-Z])/g, ' $1').toLowerCase();

/** The move between two states, from either stored shape ({from, to} or {before: {status}, after: {status}}). */
function move(c: Json): { from?: unknown; to?: unknown } {
  if ('from' in c || 'to' in c) return { from: c.from, to: c.to };
  return { from: (c.before as Json | undefined)?.status, to: (c.after as Json | undefined)?.status };
}

/** A sentence for one audit line; `person(id)` names an advisor by id. */
export function describeAudit(line: AuditFacts, person: (id: string | null | undefined) => string): AuditWords {
  const c = (line.changes && typeof line.changes === 'object' ? line.changes : {}) as Json;
  const before = (c.before ?? {}) as Json;
  const after = (c.after ?? {}) as Json;
  switch (`${line.entity}:${line.action}`) {
    case 'visit:create':
      return {
        title: 'Visit planned',
        detail: [
          c.farm ? `for ${String(c.farm)}` : '',
          c.advisorId ? `advisor ${person(c.advisorId as string)}` : 'no advisor yet',
          c.plannedOn ? `on ${formatDay(c.plannedOn as string)}` : 'no date yet',
          c.status ? `state “${state(c.status)}”` : '',
        ]
          .filter(Boolean)
          .join(', '),
      };
    case 'visit:assign':
    case 'visit:reassign':
    case 'visit:replan': {
      const parts: string[] = [];
      if (before.advisorId !== after.advisorId)
        parts.push(
          before.advisorId
            ? `advisor ${person(before.advisorId as string)} → ${person(after.advisorId as string)}`
            : `advisor ${person(after.advisorId as string)}`,
        );
      if (before.plannedOn !== after.plannedOn)
        parts.push(
          before.plannedOn
            ? `date ${formatDay(before.plannedOn as string)} → ${formatDay(after.plannedOn as string)}`
            : `date ${formatDay(after.plannedOn as string)}`,
        );
      if (after.status && before.status !== after.status) parts.push(`state “${state(before.status)}” → “${state(after.status)}”`);
      const title = line.action === 'reassign' ? 'Given to another advisor' : line.action === 'assign' ? 'Advisor assigned' : 'Planned date changed';
      return { title, detail: parts.join('; ') };
    }
    case 'visit:status': {
      const m = move(c);
      const why = str(c.cause) ?? str(c.reason);
      return { title: `State: ${state(m.from)} → ${state(m.to)}`, detail: why ? `because: ${why}` : 'changed by hand' };
    }
    case 'visit:status_jump': {
      const m = move(c);
      return { title: `State moved outside the usual order: ${state(m.from)} → ${state(m.to)}`, detail: `Reason given: ${quote(c.reason, 500)}` };
    }
    case 'visit:restore':
      return { title: 'Deleted visit restored', detail: 'by the office' };
    case 'screening:screening-failed':
      return { title: 'The screen could not run on the server', detail: 'the readings are kept; it runs again on the next sync' };
    case 'screening:screened':
      return { title: 'Screened', detail: `verdict: ${VERDICTS[c.verdict as Verdict] ?? 'unknown'}` };
    case 'sheet_send:sheet_sent':
      return { title: 'Sheet e-mailed', detail: `to ${String(c.to ?? 'the farmer')}${c.paper ? ` (${c.paper === 'letter' ? 'US Letter' : 'A4'} PDF)` : ''}` };
    case 'sheet_send:sheet_send_failed':
      return { title: 'Sheet not sent: the mail server refused it', detail: `to ${String(c.to ?? 'the farmer')}${c.error ? `: ${String(c.error)}` : ''}` };
    case 'sheet_response:sheet_acknowledged':
      return { title: 'Farmer has read the sheet', detail: 'not yet a decision' };
    case 'sheet_response:sheet_go_ahead':
      return { title: 'Farmer said: go ahead', detail: quote(c.reason) };
    case 'sheet_response:sheet_not_now':
      return { title: 'Farmer said: not now', detail: `reason: ${quote(c.reason)}` };
    case 'sheet_response:sheet_question':
      return { title: 'Farmer asked a question', detail: quote(c.text) };
    case 'sheet_response:sheet_answer':
      return { title: 'Question answered', detail: quote(c.text) };
    case 'commissioning:commission': {
      const measured = typeof c.measuredLpd === 'number' ? `${showQuantity(c.measuredLpd, 'litresPerDay', 'metric')} measured` : '';
      const predicted = typeof c.predictedLpd === 'number' ? `${showQuantity(c.predictedLpd, 'litresPerDay', 'metric')} predicted` : '';
      return { title: 'Ram checked after installation', detail: [measured, predicted].filter(Boolean).join(' against ') };
    }
    case 'photo:uploaded':
      return { title: 'Photo received', detail: typeof c.bytes === 'number' ? formatBytes(c.bytes) : '' };
    default:
      break;
  }
  const record = RECORDS[line.entity];
  if (record && ['created', 'updated', 'deleted'].includes(line.action)) {
    const name = record.name?.(c) ?? null;
    const what = `${record.a}${name ? ` (${name})` : ''}`;
    if (line.action === 'created') return { title: `Added ${what}`, detail: 'from the advisor’s phone' };
    if (line.action === 'deleted') return { title: `Removed ${record.a}`, detail: 'from the advisor’s phone' };
    const fields = [...new Set(Object.keys(c).map(field))];
    return { title: `Changed ${what}`, detail: fields.length ? `changed: ${fields.join(', ')}` : '' };
  }
  return { title: 'Other change', detail: '' };
}
