'use client';

import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { usePathname, useRouter, useSearchParams } from 'next/navigation';
import { useCallback, useMemo, useState } from 'react';
import { Button, ButtonLink } from '@/components/ui/button';
import { apiJson } from '@/lib/client/api';
import { BulkAssign } from './bulk-assign';
import { VisitFilters, type Option } from './visit-filters';
import { VisitRows, type VisitItem } from './visit-rows';

const FILTER_KEYS = ['q', 'status', 'advisor', 'verdict', 'area', 'plannedFrom', 'plannedTo', 'overdue', 'sort', 'dir', 'page'] as const;
const PAGE_SIZE = 25;

interface VisitPage {
  items: VisitItem[];
  page: number;
  pageSize: number;
  total: number;
}

/** The district's visits, fetched from /api/visits with TanStack Query; filters, sort and page live in the URL. */
export function VisitsBrowser({ advisors, areas }: { advisors: Option[]; areas: string[] }) {
  const router = useRouter();
  const pathname = usePathname();
  const searchParams = useSearchParams();
  const values = useMemo(() => {
    const out: Record<string, string> = {};
    for (const key of FILTER_KEYS) {
      const v = searchParams.get(key);
      if (v) out[key] = v;
    }
    return out;
  }, [searchParams]);
  const sort = values.sort ?? 'planned';
  const dir = (values.dir === 'asc' ? 'asc' : 'desc') as 'asc' | 'desc';
  const page = Math.max(1, Number(values.page ?? 1) || 1);
  const filterString = new URLSearchParams(Object.entries(values).filter(([k]) => k !== 'page')).toString();

  const [selected, setSelected] = useState<Set<string>>(new Set());
  const update = useCallback(
    (patch: Record<string, string>) => {
      const next = new URLSearchParams(searchParams.toString());
      for (const [k, v] of Object.entries(patch)) {
        if (v) next.set(k, v);
        else next.delete(k);
      }
      if (!('page' in patch)) next.delete('page');
      router.replace(`${pathname}?${next.toString()}`, { scroll: false });
    },
    [pathname, router, searchParams],
  );

  const query = useQuery({
    queryKey: ['visits', filterString, page],
    queryFn: () => apiJson<VisitPage>(`/api/visits?${filterString}&page=${page}&pageSize=${PAGE_SIZE}`),
    placeholderData: keepPreviousData,
  });
  const data = query.data;
  const pages = data ? Math.max(1, Math.ceil(data.total / PAGE_SIZE)) : 1;

  const toggle = (id: string) =>
    setSelected((s) => {
      const n = new Set(s);
      if (n.has(id)) n.delete(id);
      else n.add(id);
      return n;
    });
  const toggleAll = (on: boolean) =>
    setSelected((s) => {
      const n = new Set(s);
      for (const v of data?.items ?? []) {
        if (on) n.add(v.id);
        else n.delete(v.id);
      }
      return n;
    });

  return (
    <div className="space-y-4">
      <VisitFilters values={values} advisors={advisors} areas={areas} onChange={update} />
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p role="status" className="text-lg">
          {query.isPending ? 'Loading visits…' : query.isError ? '' : `${data?.total ?? 0} ${data?.total === 1 ? 'visit matches' : 'visits match'}`}
        </p>
        <ButtonLink plain variant="secondary" href={`/api/visits/export.csv?${filterString}`} download>
          Download these as CSV
        </ButtonLink>
      </div>
      {query.isError && (
        <p role="alert" className="font-bold text-clay">
          {query.error.message}
        </p>
      )}
      <BulkAssign visitIds={[...selected]} advisors={advisors} onDone={() => setSelected(new Set())} />
      {data && data.items.length === 0 && <p className="text-lg text-stone">No visits match these filters.</p>}
      {data && data.items.length > 0 && (
        <VisitRows
          items={data.items}
          sort={sort}
          dir={dir}
          selected={selected}
          onToggle={toggle}
          onToggleAll={toggleAll}
          onSort={(key) => update({ sort: key, dir: sort === key && dir === 'asc' ? 'desc' : 'asc' })}
        />
      )}
      <nav aria-label="Pages" className="flex items-center gap-3">
        <Button variant="quiet" disabled={page <= 1} onClick={() => update({ page: String(page - 1) })}>
          ← Previous
        </Button>
        <span className="figure">
          Page {page} of {pages}
        </span>
        <Button variant="quiet" disabled={page >= pages} onClick={() => update({ page: String(page + 1) })}>
          Next →
        </Button>
      </nav>
    </div>
  );
}
