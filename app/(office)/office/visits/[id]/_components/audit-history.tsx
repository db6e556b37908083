import { VISIT_STATUS_LABELS, type VisitStatus } from '@/lib/shared/domain';
import { formatDay } from '@/lib/shared/format';

export interface AuditLineView { id: number; at: string; action: string; actor: { name: string } | null; changes: unknown }

const ACTIONS: Record<string, string> = {
  create: 'Visit planned', assign: 'Advisor assigned', reassign: 'Reassigned to another advisor', replan: 'Planned date changed', status: 'State changed',
  restore: 'Deleted visit restored', 'screening-failed': 'The screen failed on the server; it runs again on the next sync',
};
const when = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', timeZone: 'UTC' });

type Side = { advisorId?: string | null; plannedOn?: string | null; status?: VisitStatus };

function describe(line: AuditLineView, names: Map<string, string>): string {
  const c = (line.changes ?? {}) as { before?: Side; after?: Side } & Side;
  const who = (id: string | null | undefined) => (id ? names.get(id) ?? 'a former advisor' : 'nobody');
  const parts: string[] = [];
  const before = c.before ?? {};
  const after = c.after ?? c;
  if (after.advisorId !== undefined && before.advisorId !== after.advisorId) parts.push(c.before ? `advisor ${who(before.advisorId)} → ${who(after.advisorId)}` : `advisor ${who(after.advisorId)}`);
  if (after.plannedOn !== undefined && before.plannedOn !== after.plannedOn) parts.push(c.before ? `date ${formatDay(before.plannedOn)} → ${formatDay(after.plannedOn)}` : `date ${formatDay(after.plannedOn)}`);
  if (after.status && before.status !== after.status) parts.push(c.before ? `${VISIT_STATUS_LABELS[before.status!] ?? before.status} → ${VISIT_STATUS_LABELS[after.status]}` : VISIT_STATUS_LABELS[after.status]);
  return parts.join('; ');
}

/** Who changed what on the visit, and when (UTC), newest first. */
export function AuditHistory({ lines, names }: { lines: AuditLineView[]; names: Map<string, string> }) {
  if (lines.length === 0) return <p className="text-stone">No changes recorded yet.</p>;
  return (
    <ol aria-label="Change history" className="divide-y divide-rule border-y border-rule">
      {lines.map((l) => (
        <li key={l.id} className="py-2">
          <span className="figure block text-sm text-stone">{when.format(new Date(l.at))} UTC</span>
          <span className="block"><strong>{l.actor?.name ?? 'The system'}</strong> · {(Object.hasOwn(ACTIONS, l.action) ? ACTIONS[l.action] : undefined) ?? l.action}</span>
          <span className="block text-stone">{describe(l, names)}</span>
        </li>
      ))}
    </ol>
  );
}
