import { StatusChip } from '@/components/status-chip';
import { VerdictMark } from '@/components/verdict-mark';
import type { VisitStatus, Verdict } from '@/lib/shared/domain';
import { formatDay } from '@/lib/shared/display/dates';

export interface VisitRowView {
  id: string;
  status: VisitStatus;
  plannedOn: string | null;
  farm: { name: string; area: string };
  advisor: { name: string } | null;
  verdict: Verdict | null;
}

/** A plain table of visits; columns a person in any role can read at a glance. */
export function VisitTable({ visits, showAdvisor = true, caption }: { visits: VisitRowView[]; showAdvisor?: boolean; caption: string }) {
  if (visits.length === 0) return <p className="text-lg text-stone">No visits yet.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr className="border-b-2 border-ink">
            <th scope="col" className="py-2 pr-4">
              Farm
            </th>
            <th scope="col" className="py-2 pr-4">
              Planned
            </th>
            {showAdvisor && (
              <th scope="col" className="py-2 pr-4">
                Advisor
              </th>
            )}
            <th scope="col" className="py-2 pr-4">
              State
            </th>
            <th scope="col" className="py-2">
              Screening
            </th>
          </tr>
        </thead>
        <tbody>
          {visits.map((v) => (
            <tr key={v.id} className="border-b border-rule align-top">
              <td className="py-3 pr-4">
                <span className="block font-bold">{v.farm.name}</span>
                <span className="block text-stone">{v.farm.area}</span>
              </td>
              <td className="figure py-3 pr-4">{formatDay(v.plannedOn)}</td>
              {showAdvisor && <td className="py-3 pr-4">{v.advisor?.name ?? <em>Not assigned</em>}</td>}
              <td className="py-3 pr-4">
                <StatusChip status={v.status} />
              </td>
              <td className="py-3">{v.verdict ? <VerdictMark verdict={v.verdict} size={18} /> : <span className="text-stone">Not screened</span>}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
