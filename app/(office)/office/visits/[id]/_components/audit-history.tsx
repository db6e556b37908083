import { describeAudit } from '@/lib/shared/audit-words';
import { formatDateTime } from '@/lib/shared/display/dates';

export interface AuditLineView {
  id: number;
  at: string;
  entity: string;
  action: string;
  actor: { name: string } | null;
  changes: unknown;
}

/** Who changed what on the visit, and when, newest first, in plain words (lib/shared/audit-words). */
export function AuditHistory({ lines, names }: { lines: AuditLineView[]; names: Map<string, string> }) {
  if (lines.length === 0) return <p className="text-stone">No changes recorded yet.</p>;
  const person = (id: string | null | undefined) => (id ? (names.get(id) ?? 'a former advisor') : 'nobody');
  return (
    <ol aria-label="Change history" className="divide-y divide-rule border-y border-rule">
      {lines.map((l) => {
        const words = describeAudit(l, person);
        return (
          <li key={l.id} className="py-2">
            <span className="figure block text-sm text-stone">{formatDateTime(l.at)}</span>
            <span className="block">
              <strong>{l.actor?.name ?? 'Fallbook itself'}</strong> · {words.title}
            </span>
            {words.detail && <span className="block text-stone">{words.detail}</span>}
          </li>
        );
      })}
    </ol>
  );
}
