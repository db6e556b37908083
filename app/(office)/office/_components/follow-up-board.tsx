import Link from 'next/link';
import { cardClasses } from '@/components/ui/card';
import { VISIT_STATUS_LABELS, VISIT_STATUSES, type VisitStatus } from '@/lib/shared/domain';

export interface AdvisorLoadView {
  advisor: { id: string; name: string; active: boolean } | null;
  byStatus: Partial<Record<VisitStatus, number>>;
  overdue: number;
}

const LIVE = VISIT_STATUSES.filter((s) => s !== 'cancelled');

/** The visits table below, filtered to what a count counts (the filters live in the URL). */
const tableLink = (filters: Record<string, string>) => `/office?${new URLSearchParams(filters).toString()}#visits`;

/** Where every visit stands: counts by state for the district and for each advisor, overdue in words; each count opens the table filtered to it. */
export function FollowUpBoard({ byStatus, overdue, loads }: { byStatus: Partial<Record<VisitStatus, number>>; overdue: number; loads: AdvisorLoadView[] }) {
  return (
    <section aria-labelledby="board" className="space-y-4">
      <h2 id="board" className="text-xl font-bold">
        Where every visit stands
      </h2>
      <ol className="grid grid-cols-2 gap-2 sm:grid-cols-4">
        {LIVE.map((status, i) => (
          <li key={status}>
            <Link
              href={tableLink({ status })}
              className={cardClasses({ padding: 'md', className: 'block h-full text-ink no-underline hover:border-slate' })}
              aria-label={`${byStatus[status] ?? 0} visits: ${VISIT_STATUS_LABELS[status]}`}
            >
              <span className="figure block text-sm text-stone">{i + 1}.</span>
              <span className="figure block text-2xl font-semibold">{byStatus[status] ?? 0}</span>
              <span className="block">{VISIT_STATUS_LABELS[status]}</span>
            </Link>
          </li>
        ))}
      </ol>
      {overdue > 0 && (
        <Link href={tableLink({ overdue: '1' })} className="inline-block rounded-md border-2 border-clay bg-white px-3 py-2 font-bold text-clay">
          ⚠ {overdue} {overdue === 1 ? 'visit is' : 'visits are'} overdue (planned day passed, site not yet walked)
        </Link>
      )}
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-left" aria-label="Visits by advisor">
          <thead>
            <tr className="border-b-2 border-ink">
              <th scope="col" className="py-2 pr-3">
                Advisor
              </th>
              {LIVE.map((s) => (
                <th key={s} scope="col" className="py-2 pr-3 text-sm">
                  {VISIT_STATUS_LABELS[s]}
                </th>
              ))}
              <th scope="col" className="py-2 text-sm">
                Overdue
              </th>
            </tr>
          </thead>
          <tbody>
            {loads.map((l) => (
              <tr key={l.advisor?.id ?? 'none'} className="border-b border-rule">
                <th scope="row" className="py-2 pr-3 font-bold">
                  {l.advisor ? l.advisor.name : <em>Not assigned</em>}
                  {l.advisor && !l.advisor.active && <span className="block text-sm text-stone">account switched off</span>}
                </th>
                {LIVE.map((s) => (
                  <td key={s} className="figure py-2 pr-3">
                    {l.byStatus[s] ? <Link href={tableLink({ status: s, advisor: l.advisor?.id ?? 'none' })}>{l.byStatus[s]}</Link> : 0}
                  </td>
                ))}
                <td className={`figure py-2 ${l.overdue ? 'font-bold text-clay' : ''}`}>
                  {l.overdue ? (
                    <Link href={tableLink({ overdue: '1', advisor: l.advisor?.id ?? 'none' })} className="text-clay">
                      ⚠ {l.overdue}
                    </Link>
                  ) : (
                    0
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
