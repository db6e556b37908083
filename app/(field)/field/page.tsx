'use client';

import Link from 'next/link';
import { cardClasses } from '@/components/ui/card';
import { VISIT_STATUS_LABELS, type VisitStatus } from '@/lib/shared/domain';
import { formatDay } from '@/lib/shared/display/dates';
import { isOverdue } from '@/lib/shared/visit-rules';
import { decisionWords, waitingWords } from './_components/sync-words';
import { FieldQuestions } from './_components/field-questions';
import { useFieldUser } from './_components/field-session';
import { useFieldQuery } from './_components/use-field-query';

export default function FieldHome() {
  const user = useFieldUser();
  // Nothing of anyone's is read until the frame knows whose field book this is.
  const visits = useFieldQuery(user !== null ? 'homeVisits' : null);
  return (
    <div className="space-y-5">
      <h1 className="text-3xl font-bold text-slate">My site visits</h1>
      {visits === undefined && <p className="text-lg">Reading the phone…</p>}
      {visits?.rows.length === 0 && !visits.synced && <p className="text-lg">Fetching your visits from the server…</p>}
      {visits?.rows.length === 0 && visits.synced && (
        <p className="text-lg">No visits on this phone yet. They arrive at the next sync once your coordinator assigns them.</p>
      )}
      <ul className="space-y-3">
        {visits?.rows.map((v) => (
          <li key={v.id}>
            {/* No prefetch: every visit opens the same static page, which the service worker already holds. */}
            <Link href={`/field/visit?id=${v.id}`} prefetch={false} className={cardClasses({ tone: 'field', className: 'block text-ink no-underline' })}>
              <span className="block text-xl font-bold">{v.farm?.name ?? 'Farm'}</span>
              <span className="block text-stone">{v.farm?.area}</span>
              <span className="mt-1 block">
                {v.plannedOn ? <span className="figure">{formatDay(v.plannedOn)}</span> : 'No date yet'} ·{' '}
                {VISIT_STATUS_LABELS[v.status as VisitStatus] ?? 'Other'}
                {isOverdue({ ...v, status: v.status as VisitStatus, lastSyncedAt: null }) && (
                  <strong className="text-clay" data-testid="overdue">
                    {' '}
                    · ⚠ Overdue
                  </strong>
                )}
              </span>
              {(v.waiting > 0 || v.parked > 0) && (
                <span className="mt-1 block font-bold">
                  {[v.waiting > 0 && waitingWords({ waiting: v.waiting, photos: 0, parked: 0 }), v.parked > 0 && decisionWords(v.parked)]
                    .filter(Boolean)
                    .join(' · ')}
                </span>
              )}
            </Link>
          </li>
        ))}
      </ul>
      {/* Shown below the list once the list has its rows (or the phone knows it has none), so the list never pushes it down. */}
      <FieldQuestions enabled={user !== null} shown={visits !== undefined && (visits.rows.length > 0 || visits.synced)} />
    </div>
  );
}
