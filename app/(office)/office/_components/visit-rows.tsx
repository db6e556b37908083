'use client';

import Link from 'next/link';
import { StatusChip } from '@/components/status-chip';
import { VerdictMark } from '@/components/verdict-mark';
import type { VisitStatus, Verdict } from '@/lib/shared/domain';
import { formatDateTime, formatDay } from '@/lib/shared/display/dates';

export interface VisitItem {
  id: string;
  status: VisitStatus;
  plannedOn: string | null;
  lastSyncedAt: string | null;
  overdue: boolean;
  farm: { id: string; name: string; area: string };
  farmer: { name: string } | null;
  advisor: { id: string; name: string } | null;
  verdict: Verdict | null;
}

const COLUMNS = [
  { key: 'farm', label: 'Farm' },
  { key: null, label: 'Farmer' },
  { key: 'advisor', label: 'Advisor' },
  { key: 'planned', label: 'Planned' },
  { key: 'status', label: 'State' },
  { key: null, label: 'Screening' },
  { key: 'synced', label: 'Last synced' },
] as const;

/** The visits table: sortable headers, a tick box per row for bulk assignment, overdue rows marked in words. */
export function VisitRows({
  items,
  sort,
  dir,
  onSort,
  selected,
  onToggle,
  onToggleAll,
}: {
  items: VisitItem[];
  sort: string;
  dir: 'asc' | 'desc';
  onSort: (key: string) => void;
  selected: Set<string>;
  onToggle: (id: string) => void;
  onToggleAll: (on: boolean) => void;
}) {
  const allTicked = items.length > 0 && items.every((v) => selected.has(v.id));
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-left" aria-label="Visits in the district">
        <thead>
          <tr className="border-b-2 border-ink">
            <th scope="col" className="w-12 py-2">
              <input
                type="checkbox"
                aria-label="Tick every visit on this page"
                className="h-6 w-6"
                checked={allTicked}
                onChange={(e) => onToggleAll(e.target.checked)}
              />
            </th>
            {COLUMNS.map((c) => (
              <th
                key={c.label}
                scope="col"
                className="py-2 pr-3"
                aria-sort={c.key && sort === c.key ? (dir === 'asc' ? 'ascending' : 'descending') : undefined}
              >
                {c.key ? (
                  <button type="button" onClick={() => onSort(c.key)} className="min-h-12 font-bold underline decoration-rule underline-offset-4">
                    {c.label}
                    {sort === c.key ? (dir === 'asc' ? ' ▲' : ' ▼') : ''}
                  </button>
                ) : (
                  c.label
                )}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {items.map((v) => (
            <tr key={v.id} className={`border-b border-rule align-top ${v.overdue ? 'bg-[#FBEFEA]' : ''}`}>
              <td className="py-3">
                <input type="checkbox" className="h-6 w-6" aria-label={`Tick ${v.farm.name}`} checked={selected.has(v.id)} onChange={() => onToggle(v.id)} />
              </td>
              <td className="py-3 pr-3">
                <Link href={`/office/visits/${v.id}`} className="block font-bold">
                  {v.farm.name}
                </Link>
                <span className="block text-stone">{v.farm.area}</span>
              </td>
              <td className="py-3 pr-3">{v.farmer?.name ?? <span className="text-stone">—</span>}</td>
              <td className="py-3 pr-3">{v.advisor?.name ?? <em>Not assigned</em>}</td>
              <td className="py-3 pr-3">
                <span className="figure block">{formatDay(v.plannedOn)}</span>
                {v.overdue && <strong className="mt-1 inline-block rounded border-2 border-clay px-1 text-sm text-clay">⚠ Overdue</strong>}
              </td>
              <td className="py-3 pr-3">
                <StatusChip status={v.status} />
              </td>
              <td className="py-3 pr-3">{v.verdict ? <VerdictMark verdict={v.verdict} size={16} /> : <span className="text-stone">Not screened</span>}</td>
              <td className="figure py-3">{v.lastSyncedAt ? formatDateTime(v.lastSyncedAt) : <span className="text-stone">Never</span>}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
