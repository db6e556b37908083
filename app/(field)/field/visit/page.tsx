'use client';

import { useFieldQuery } from '../_components/use-field-query';
import dynamic from 'next/dynamic';
import Link from 'next/link';
import { Suspense } from 'react';
import { cardClasses } from '@/components/ui/card';
import { fieldDb } from '@/lib/client/db';
import { formatDay } from '@/lib/shared/display/dates';
import { OfflineMapNote } from '../_components/offline-map-note';

// The engine loads only when the preview shows (its chunk is precached, so this works offline too).
const ScreenPreview = dynamic(() => import('../_components/screen-preview').then((m) => m.ScreenPreview), {
  ssr: false,
  loading: () => <p className="text-stone">Working out the screen…</p>,
});
import { useVisit, useVisitId } from '../_components/use-field-data';

const SECTIONS = [
  { href: 'flow', title: 'Source and flow', table: 'flowMeasurements' },
  { href: 'fall', title: 'Fall and lift', table: 'fallReadings' },
  { href: 'points', title: 'Points', table: 'points' },
  { href: 'photos', title: 'Photos', table: 'photos' },
  { href: 'pipes', title: 'Pipe runs', table: 'pipeRuns' },
] as const;

function VisitOverview() {
  const id = useVisitId();
  const data = useVisit(id);
  const counts = useFieldQuery(async () => {
    const db = fieldDb();
    const entries = await Promise.all(
      SECTIONS.map(async (s) => {
        const rows = (await db.table(s.table).where('visitId').equals(id).toArray()) as {
          deletedAt: string | null;
          role?: string;
          chainageM?: number | null;
        }[];
        // Profile stations count under "Creek profile", as the points page leaves them to it.
        return [s.href, rows.filter((r) => !r.deletedAt && !(r.role === 'station' && r.chainageM != null)).length] as const;
      }),
    );
    const visit = await db.visits.get(id);
    const demand = visit ? (await db.demandLines.where('farmId').equals(visit.farmId).toArray()).filter((r) => !r.deletedAt).length : 0;
    const stations = (await db.points.where('visitId').equals(id).toArray()).filter((p) => !p.deletedAt && p.role === 'station').length;
    return Object.fromEntries([...entries, ['demand', demand], ['positions', stations]]) as Record<string, number>;
  }, [id]);
  if (data === undefined) return <p className="text-lg">Reading the phone…</p>;
  if (data === null)
    return (
      <p className="text-lg">
        This visit is not on this phone. <Link href="/field">Back to my visits</Link>
      </p>
    );
  return (
    <div className="space-y-5">
      <div>
        <Link href="/field">← My visits</Link>
        <h1 className="mt-2 text-3xl font-bold text-slate">{data.farm?.name ?? 'Visit'}</h1>
        <p className="text-stone">
          {data.farm?.area} · planned <span className="figure">{formatDay(data.visit.plannedOn)}</span>
        </p>
        <OfflineMapNote visitId={id} />
      </div>
      <ul className="grid gap-3 sm:grid-cols-2">
        {[
          ...SECTIONS,
          { href: 'demand', title: 'Water needed' },
          { href: 'positions', title: 'Creek profile, best positions' },
          { href: 'commission', title: 'Commissioning check' },
        ].map((s) => (
          <li key={s.href}>
            <Link
              href={`/field/visit/${s.href}?id=${id}`}
              className={cardClasses({
                tone: 'field',
                padding: 'none',
                className: 'flex min-h-16 items-center justify-between px-4 text-lg font-bold text-ink no-underline',
              })}
            >
              <span>{s.title}</span>
              <span className="figure text-stone" data-testid={`count-${s.href}`}>
                {s.href === 'commission' ? '' : (counts?.[s.href] ?? 0)}
              </span>
            </Link>
          </li>
        ))}
      </ul>
      <ScreenPreview visitId={id} />
      {/* The sheet is rendered by the server from the stored screening: it needs a signal. */}
      <p>
        <a href={`/sheets/${id}`} className="text-lg font-bold">
          The farmer&apos;s sheet (needs a signal)
        </a>
      </p>
    </div>
  );
}

export default function VisitPage() {
  return (
    <Suspense>
      <VisitOverview />
    </Suspense>
  );
}
