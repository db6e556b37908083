'use client';

import { useFieldQuery } from '../_components/use-field-query';
import Link from 'next/link';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { fieldDb, type OutboxEntry } from '@/lib/client/db';
import { waitingPhotos } from '@/lib/client/photo-queue';
import { requestSync } from '@/lib/client/sync/triggers';
import { discardParked, resolveConflict, retryParked } from '@/lib/client/sync/resolve';
import type { UnitSystem } from '@/lib/shared/domain';
import { describeRecord, fieldLabel, showFieldValue } from '@/lib/shared/conflict-fields';
import { isSchemaText } from '@/lib/shared/field-messages';
import { useFieldUser } from '../_components/field-session';
import { decisionWords, waitingWords } from '../_components/sync-words';
import { useUnits } from '../_components/use-field-data';

function Conflict({ entry, units }: { entry: OutboxEntry; units: UnitSystem }) {
  const fields = entry.result?.conflict?.fields ?? [];
  const server = (entry.result?.conflict?.server ?? {}) as Record<string, unknown>;
  const mine = (entry.op.changes ?? {}) as Record<string, unknown>;
  return (
    <Card as="li" tone="caution" padding="md" className="space-y-2">
      <p className="font-bold">Changed on the server while you were out: {describeRecord(entry.entity, { ...server, ...mine })}</p>
      <table className="w-full text-left">
        <thead>
          <tr>
            <th className="pr-2">Field</th>
            <th className="pr-2">Yours</th>
            <th>Server</th>
          </tr>
        </thead>
        <tbody>
          {fields.map((f) => (
            <tr key={f} className="border-t border-rule align-top">
              <td className="pr-2 font-bold">{fieldLabel(f)}</td>
              <td className="figure pr-2 wrap-anywhere">{showFieldValue(f, mine[f], units)}</td>
              <td className="figure wrap-anywhere">{showFieldValue(f, server[f], units)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <div className="grid grid-cols-2 gap-2">
        <Button size="wide" onClick={() => resolveConflict(entry.seq!, 'mine')}>
          Keep mine
        </Button>
        <Button variant="secondary" size="wide" onClick={() => resolveConflict(entry.seq!, 'theirs')}>
          Take the server&apos;s
        </Button>
      </div>
    </Card>
  );
}

/** The server's reason in plain words: never a schema path or zod's own wording. */
function refusalReason(entry: OutboxEntry): string {
  const error = entry.result?.error;
  const plain = (m: string) => m.replace(/^[\w.]+: /, '');
  const candidates = [error?.message, ...Object.values(error?.fieldErrors ?? {}).flat()].filter((m): m is string => !!m).map(plain);
  return candidates.find((m) => !isSchemaText(m)) ?? 'The server could not use this change.';
}

function Refused({ entry }: { entry: OutboxEntry }) {
  return (
    <Card as="li" tone="alarm" padding="md" className="space-y-2">
      <p className="font-bold">The server refused a change to {describeRecord(entry.entity, (entry.op.changes ?? {}) as Record<string, unknown>)}</p>
      <p>{refusalReason(entry)}</p>
      <p className="text-stone">Give it up to put back what the server holds; send it again once the reason is fixed.</p>
      <div className="grid grid-cols-2 gap-2">
        <Button size="wide" onClick={() => retryParked(entry.seq!)}>
          Send again
        </Button>
        <Button variant="danger" size="wide" onClick={() => discardParked(entry.seq!)}>
          Give it up
        </Button>
      </div>
    </Card>
  );
}

/** Photos the server refused (a 4xx): the reason, and a way to try again; the bytes stay on the phone. */
function RefusedPhotos() {
  const refused = useFieldQuery(async () => {
    const db = fieldDb();
    const blobs = await waitingPhotos(db, (b) => !!b.lastError);
    return Promise.all(blobs.map(async (b) => ({ id: b.id, error: b.lastError, caption: (await db.photos.get(b.id))?.caption ?? '' })));
  });
  if (!refused || refused.length === 0) return null;
  async function tryAgain(id: string) {
    await fieldDb().photoBlobs.update(id, { nextAttemptAt: 0 });
    await requestSync();
  }
  return (
    <>
      <h2 className="text-xl font-bold">Photos the server did not take</h2>
      <p>They stay on this phone and are tried again at each sync.</p>
      <ul className="space-y-3">
        {refused.map((p) => (
          <Card as="li" tone="alarm" padding="md" className="space-y-2" key={p.id}>
            <p className="font-bold">{p.caption ? `Photo “${p.caption}”` : 'A photo'}</p>
            <p>{p.error?.message}</p>
            <Button size="wide" onClick={() => tryAgain(p.id)}>
              Try again now
            </Button>
          </Card>
        ))}
      </ul>
    </>
  );
}

export default function SyncPage() {
  const entries = useFieldQuery(() => fieldDb().outbox.orderBy('seq').toArray());
  const units = useUnits();
  const parked = entries?.filter((e) => e.status !== 'pending') ?? [];
  // The same counts as the sync bar and the home (changes and photos), from the same query.
  const counts = useFieldQuery(useFieldUser() !== null ? 'syncSummary' : null);
  return (
    <div className="space-y-5">
      <Link href="/field">← My visits</Link>
      <h1 className="text-3xl font-bold text-slate">Waiting to send</h1>
      <p className="text-lg" data-testid="sync-page-summary">
        {counts ? `${waitingWords(counts)}.` : 'Checking the phone…'} Nothing leaves this phone before the server has it.
      </p>
      <h2 className="text-xl font-bold">{parked.length > 0 ? decisionWords(parked.length) : 'Needs your decision'}</h2>
      {parked.length === 0 && <p className="text-stone">Nothing to decide.</p>}
      <ul className="space-y-3">
        {/* A conflict shows both values in the reader's units: it waits for them. */}
        {parked.map((e) =>
          e.status !== 'conflict' ? <Refused key={e.seq} entry={e} /> : units !== undefined ? <Conflict key={e.seq} entry={e} units={units} /> : null,
        )}
      </ul>
      <RefusedPhotos />
    </div>
  );
}
