import type { Metadata } from 'next';
import Link from 'next/link';
import { StatusChip } from '@/components/status-chip';
import { Button, ButtonLink } from '@/components/ui/button';
import { Input, Select } from '@/components/ui/control';
import { TapLink } from '@/components/ui/tap-link';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { FARM_SORTS, listFarms } from '@/lib/server/data/farms';
import { showQuantity } from '@/lib/shared/display/quantities';

export const metadata: Metadata = { title: 'Farms' };

const SORT_WORDS: Record<(typeof FARM_SORTS)[number], string> = { name: 'Name', area: 'Area', added: 'Newest first' };

export default async function FarmsPage({ searchParams }: { searchParams: Promise<{ page?: string; q?: string; sort?: string }> }) {
  const user = await requirePageUser(['coordinator'], '/office/farms');
  const params = await searchParams;
  const page = Math.max(1, Number(params.page ?? 1) || 1);
  const q = (params.q ?? '').slice(0, 100);
  const sort = FARM_SORTS.find((s) => s === params.sort) ?? 'name';
  const farms = await listFarms(user, { page, pageSize: 50 }, { q, sort });
  const pages = Math.max(1, Math.ceil(farms.total / 50));
  const pageLink = (n: number) => `/office/farms?${new URLSearchParams({ ...(q ? { q } : {}), sort, page: String(n) }).toString()}`;
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-3xl font-bold text-slate">Farms</h1>
        <ButtonLink href="/office/farms/new">Add a farm</ButtonLink>
      </div>
      <form role="search" aria-label="Find farms" method="get" action="/office/farms" className="grid max-w-3xl gap-3 sm:grid-cols-[2fr_1fr_auto] sm:items-end">
        <label className="block font-bold">
          Farm, area or farmer
          <Input name="q" defaultValue={q} />
        </label>
        <label className="block font-bold">
          Sort by
          <Select name="sort" defaultValue={sort}>
            {FARM_SORTS.map((s) => (
              <option key={s} value={s}>
                {SORT_WORDS[s]}
              </option>
            ))}
          </Select>
        </label>
        <Button type="submit" variant="secondary">
          Show
        </Button>
      </form>
      <p className="figure">
        {farms.total} {farms.total === 1 ? 'farm' : 'farms'}
        {q && ` matching “${q}”`}
      </p>
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-left" aria-label="Farms">
          <thead>
            <tr className="border-b-2 border-ink">
              <th className="py-2 pr-3">Farm</th>
              <th className="py-2 pr-3">Farmer</th>
              <th className="py-2 pr-3">Stage</th>
              <th className="py-2 pr-3">Daily need</th>
              <th className="py-2" />
            </tr>
          </thead>
          <tbody>
            {farms.items.map((f) => (
              <tr key={f.id} className="border-b border-rule align-top">
                <td className="py-3 pr-3">
                  <Link href={`/office/farms/${f.id}`} className="block font-bold">
                    {f.name}
                  </Link>
                  <span className="block text-stone">{f.area}</span>
                </td>
                <td className="py-3 pr-3">{f.owner?.name ?? <em>No account</em>}</td>
                <td className="py-3 pr-3">{f.stage ? <StatusChip status={f.stage} /> : <span className="text-stone">No visit yet</span>}</td>
                <td className="figure py-3 pr-3">{f.demandLpd > 0 ? showQuantity(f.demandLpd, 'litresPerDay', user.units) : '—'}</td>
                <td className="py-3">
                  <TapLink href={`/office/visits/new?farm=${f.id}`}>Plan a visit</TapLink>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {pages > 1 && (
        <p className="figure">
          Page {page} of {pages} {page > 1 && <Link href={pageLink(page - 1)}>← Previous</Link>} {page < pages && <Link href={pageLink(page + 1)}>Next →</Link>}
        </p>
      )}
    </div>
  );
}
