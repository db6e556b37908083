'use client';

import { useFieldQuery } from '../../../_components/use-field-query';
import { Card } from '@/components/ui/card';
import { commissioningCheck, type CommissioningResult, type DesignPoint } from '@/lib/engine';
import { fieldDb, type LocalRecord, type OutboxEntry } from '@/lib/client/db';
import type { UnitSystem } from '@/lib/shared/domain';
import { formatDateTime } from '@/lib/shared/display/dates';
import { CheckSummary } from './check-summary';

type Sending = { state: 'waiting' } | { state: 'sent' } | { state: 'refused'; message: string };

/**
 * The phone's own check of a stored record (the fall may be the screening's, which only the server
 * knows), with the waste-valve advice for the visit's design point where the phone's screen gives one.
 */
function localCheck(r: LocalRecord<'commissioning'>, design: DesignPoint | null): CommissioningResult | null {
  if (r.fallM === null || !(r.liftM > r.fallM)) return null;
  try {
    return commissioningCheck(
      {
        driveLpm: r.driveLpm,
        deliveredLpm: r.deliveredLpm,
        beatsPerMinute: r.beatsPerMinute,
        liftM: r.liftM,
        fallM: r.fallM,
        ...(r.wasteValveStrokeMm ? { wasteValveStrokeMm: r.wasteValveStrokeMm } : {}),
      },
      null,
      design,
    );
  } catch {
    return null;
  }
}

function sendingOf(entries: OutboxEntry[]): Sending {
  const parked = entries.find((e) => e.status !== 'pending');
  if (parked) return { state: 'refused', message: parked.result?.error?.message ?? 'The server did not take it.' };
  return entries.length > 0 ? { state: 'waiting' } : { state: 'sent' };
}

const LABEL: Record<Sending['state'], string> = { waiting: 'Not yet sent', sent: 'Sent', refused: 'Refused by the server' };

/**
 * The checks recorded on this phone for the visit, newest first, each with the phone's result and
 * whether it has reached the server (it waits in the outbox until the server acknowledged it).
 */
export function RecordedChecks({ visitId, units, design }: { visitId: string; units: UnitSystem; design: DesignPoint | null }) {
  const rows = useFieldQuery(async () => {
    const db = fieldDb();
    const records = (await db.commissionings.where('visitId').equals(visitId).toArray()).sort((a, b) => b.updatedAt.localeCompare(a.updatedAt));
    return Promise.all(records.map(async (r) => ({ r, sending: sendingOf(await db.outbox.where('entityId').equals(r.id).toArray()) })));
  }, [visitId]);
  if (!rows?.length) return null;
  return (
    <section aria-labelledby="recorded" className="space-y-3">
      <h2 id="recorded" className="text-xl font-bold">
        Recorded on this phone
      </h2>
      <ol className="space-y-3">
        {rows.map(({ r, sending }) => {
          const check = localCheck(r, design);
          return (
            <Card as="li" tone="strong" key={r.id} data-testid="recorded-check">
              <p className="flex flex-wrap items-center gap-2">
                <span
                  data-testid="send-state"
                  className={`rounded-full border-2 px-3 py-1 font-bold ${sending.state === 'sent' ? 'border-slate text-slate' : sending.state === 'refused' ? 'border-clay text-clay' : 'border-stone text-ink'}`}
                >
                  {sending.state === 'sent' ? '✓ ' : sending.state === 'refused' ? '✕ ' : '… '}
                  {LABEL[sending.state]}
                </span>
                <span className="text-stone">{formatDateTime(r.updatedAt)}</span>
              </p>
              {sending.state === 'refused' && (
                <p className="font-bold text-clay">{sending.message} On the sync page: send it again once the reason is fixed, or give it up.</p>
              )}
              {check ? (
                <CheckSummary check={check} units={units} />
              ) : (
                <p>The fall is the screening&rsquo;s: the server works the efficiencies out when it arrives.</p>
              )}
              <p className="text-sm text-stone">
                {sending.state === 'sent'
                  ? 'On the server: compared there with the screening\u2019s prediction; the visit is commissioned.'
                  : 'Worked out on this phone; compared with the screening\u2019s prediction once it reaches the server.'}
              </p>
            </Card>
          );
        })}
      </ol>
    </section>
  );
}
