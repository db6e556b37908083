import type { Metadata } from 'next';
import Link from 'next/link';
import { verdictSvg, VERDICT_WORDS } from '@/components/verdict-svg';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { districtSites } from '@/lib/server/data/district-map';
import { VISIT_STATUS_LABELS } from '@/lib/shared/domain';
import { DistrictMap } from './_components/district-map';

export const metadata: Metadata = { title: 'Map of the district' };
const LEGEND = ['go', 'conditional', 'gravity', 'no-go', 'none'] as const;

export default async function MapPage() {
  const user = await requirePageUser(['coordinator'], '/office/map');
  const sites = (await districtSites(user)).map((s) => ({ ...s, statusLabel: VISIT_STATUS_LABELS[s.status] }));
  return (
    <div className="space-y-4">
      <h1 className="text-3xl font-bold text-slate">Map of the district</h1>
      <ul aria-label="Legend" className="flex flex-wrap gap-4">
        {LEGEND.map((v) => (
          <li key={v} className="flex items-center gap-2">
            <span dangerouslySetInnerHTML={{ __html: verdictSvg(v, 40) }} />
            <span className="font-bold">{VERDICT_WORDS[v]}</span>
          </li>
        ))}
      </ul>
      <DistrictMap sites={sites} />
      <p className="text-stone">Each mark is a located point of a site walk (intake, pump site, tank), or the farm itself where no points were taken yet. Select a mark to open the visit.</p>
      <details>
        <summary className="min-h-12 cursor-pointer font-bold">The same sites as a list</summary>
        <ul className="mt-2 divide-y divide-rule">
          {sites.map((s) => (
            <li key={s.visitId} className="py-2"><Link href={`/office/visits/${s.visitId}`}>{s.farmName}</Link> · {VERDICT_WORDS[s.verdict ?? 'none']} · {s.statusLabel} · {s.points.length} {s.points.length === 1 ? 'point' : 'points'}</li>
          ))}
        </ul>
      </details>
    </div>
  );
}
