import type { Metadata } from 'next';
import Link from 'next/link';
import { verdictSvg, VERDICT_WORDS } from '@/components/verdict-svg';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { districtSites, farmsWithoutVisits } from '@/lib/server/data/district-map';
import { VISIT_STATUS_LABELS } from '@/lib/shared/domain';
import { boundsOf, splitOutliers } from '@/lib/shared/map-fit';
import { DistrictMap } from './_components/district-map';
import { NO_VISIT_MARK } from './_components/marks';

export const metadata: Metadata = { title: 'Map of the district' };
const LEGEND = ['go', 'conditional', 'gravity', 'no-go', 'none'] as const;

export default async function MapPage() {
  const user = await requirePageUser(['coordinator'], '/office/map');
  const [allSites, allFarms] = await Promise.all([districtSites(user), farmsWithoutVisits(user)]);
  const sites = allSites.map((s) => ({ ...s, statusLabel: VISIT_STATUS_LABELS[s.status] }));
  // One mark per site (its first point) and per farm decides what the map fits; far strays are named below it.
  const marks = [
    ...sites.flatMap((s) =>
      s.points[0] ? [{ key: `visit:${s.visitId}`, name: s.farmName, href: `/office/visits/${s.visitId}`, lat: s.points[0].lat, lon: s.points[0].lon }] : [],
    ),
    ...allFarms.map((f) => ({ key: `farm:${f.farmId}`, name: f.farmName, href: `/office/farms/${f.farmId}`, lat: f.lat, lon: f.lon })),
  ];
  const { inside, outliers } = splitOutliers(marks);
  const stray = new Set(outliers.map((o) => o.key));
  const fit = boundsOf([...sites.flatMap((s) => (stray.has(`visit:${s.visitId}`) ? [] : s.points)), ...inside.filter((m) => m.key.startsWith('farm:'))]);
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
        <li className="flex items-center gap-2">
          <span dangerouslySetInnerHTML={{ __html: NO_VISIT_MARK }} />
          <span className="font-bold">Farm without a visit</span>
        </li>
      </ul>
      {outliers.length > 0 && (
        <div role="note" aria-label="Left off the map" className="border-l-4 border-rule pl-3">
          <p className="font-bold">Left off the map, far from the rest of the district (check their positions):</p>
          <ul className="list-disc pl-6">
            {outliers.map((o) => (
              <li key={o.key}>
                <Link href={o.href}>{o.name}</Link>, about {Math.round(o.km).toLocaleString('en-GB')} km away
              </li>
            ))}
          </ul>
        </div>
      )}
      <DistrictMap sites={sites.filter((s) => !stray.has(`visit:${s.visitId}`))} farms={allFarms.filter((f) => !stray.has(`farm:${f.farmId}`))} fit={fit} />
      <p className="text-stone">
        Each site is one mark, labelled with its farm: at the pump site where the advisor took one, otherwise another point of the walk, or the farm itself
        before any. Marks close together gather into a numbered circle (how many farms): select it to zoom in. Select a mark to open the visit.
      </p>
      <details>
        <summary className="min-h-12 cursor-pointer font-bold">The same sites as a list</summary>
        <ul className="mt-2 divide-y divide-rule">
          {sites.map((s) => (
            <li key={s.visitId} className="py-2">
              <Link href={`/office/visits/${s.visitId}`}>{s.farmName}</Link> · {VERDICT_WORDS[s.verdict ?? 'none']} · {s.statusLabel} · {s.points.length}{' '}
              {s.points.length === 1 ? 'point' : 'points'}
            </li>
          ))}
          {allFarms.map((f) => (
            <li key={f.farmId} className="py-2">
              <Link href={`/office/farms/${f.farmId}`}>{f.farmName}</Link> · no visit yet ·{' '}
              <Link href={`/office/visits/new?farm=${f.farmId}`}>Plan a visit</Link>
            </li>
          ))}
        </ul>
      </details>
    </div>
  );
}
