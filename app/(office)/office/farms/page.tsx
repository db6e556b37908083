import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { listFarms } from '@/lib/server/data/farms';
import { formatLitresPerDay } from '@/lib/shared/format';

export const metadata: Metadata = { title: 'Farms' };

export default async function FarmsPage({ searchParams }: { searchParams: Promise<{ page?: string }> }) {
  const user = await requirePageUser(['coordinator'], '/office/farms');
  const page = Math.max(1, Number((await searchParams).page ?? 1) || 1);
  const farms = await listFarms(user, { page, pageSize: 50 });
  const pages = Math.max(1, Math.ceil(farms.total / 50));
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-3xl font-bold text-slate">Farms</h1>
        <Link href="/office/farms/new" className="inline-flex min-h-12 items-center rounded-md bg-slate px-4 font-bold text-white no-underline">Add a farm</Link>
      </div>
      <table className="w-full border-collapse text-left" aria-label="Farms">
        <thead><tr className="border-b-2 border-ink"><th className="py-2 pr-3">Farm</th><th className="py-2 pr-3">Farmer</th><th className="py-2 pr-3">Daily need</th><th className="py-2" /></tr></thead>
        <tbody>
          {farms.items.map((f) => (
            <tr key={f.id} className="border-b border-rule align-top">
              <td className="py-3 pr-3"><Link href={`/office/farms/${f.id}`} className="block font-bold">{f.name}</Link><span className="block text-stone">{f.area}</span></td>
              <td className="py-3 pr-3">{f.owner?.name ?? <em>No account</em>}</td>
              <td className="figure py-3 pr-3">{f.demandLpd > 0 ? formatLitresPerDay(f.demandLpd) : '—'}</td>
              <td className="py-3"><Link href={`/office/visits/new?farm=${f.id}`} className="inline-flex min-h-12 items-center font-bold">Plan a visit</Link></td>
            </tr>
          ))}
        </tbody>
      </table>
      {pages > 1 && <p className="figure">Page {page} of {pages} {page < pages && <Link href={`/office/farms?page=${page + 1}`}>Next →</Link>}</p>}
    </div>
  );
}
