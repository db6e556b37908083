'use client';

// Every capture form checks the record it is about to save with the shared schema the server uses
// (zodResolver, the resolver react-hook-form forms use), in the advisor's units, and asks "is this
// right?" about unusual values before it saves. Messages sit at the field they are about; nothing is
// saved while any stands. The schemas load on the form's first use (lib/client/load-record-checks.ts),
// after the screen painted.
// The forms keep their own inputs, so the check holds only its messages: no react-hook-form form. A
// form's mount costs a form control, and a state update in its layout effect redraws the whole
// capture form once more inside the commit that first draws it (a task of 50–130 ms at 4× slower CPU).
import { useState } from 'react';
import type { FieldValues } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { loadRecordChecks, useRecordChecksOnFirstUse } from '@/lib/client/load-record-checks';
import { RecordRefused } from '@/lib/client/record-refused';
import type { UnitSystem } from '@/lib/shared/domain';
import type { Unusual } from '@/lib/shared/plausibility';
import type { EntityFields, SyncEntity } from '@/lib/shared/schemas/sync';

export interface RecordCheck {
  /** The message for a path ("measurement.trials.2.seconds"), or for any path under it. */
  errorAt: (path: string, under?: boolean) => string | undefined;
  /** Unusual values still to confirm at a path (or under it). */
  askAt: (path: string, under?: boolean) => Unusual[];
  confirm: (code: string) => void;
  /** Messages no field of the form shows (the form lists them above its save button). */
  unplaced: (shown: readonly string[]) => string[];
  clear: () => void;
}

function collect(errors: unknown, prefix = ''): Record<string, string> {
  const out: Record<string, string> = {};
  if (!errors || typeof errors !== 'object') return out;
  for (const [key, value] of Object.entries(errors as Record<string, unknown>)) {
    if (key === 'ref') continue;
    const path = key === 'root' ? prefix : prefix ? `${prefix}.${key}` : key;
    const v = value as { message?: unknown; type?: unknown };
    if (typeof v?.message === 'string' && typeof v.type === 'string') out[path] = v.message;
    else Object.assign(out, collect(value, path));
  }
  return out;
}

// The checks' code did not arrive (first use with no signal before the app was stored on the phone).
const CHECKS_MISSING = 'Nothing was saved: this screen could not load its checks. What you typed is still here; save again once the phone has a signal.';

const isUnder = (path: string, prefix: string) => path === prefix || path.startsWith(`${prefix}.`);

/**
 * `save(id, fields)` checks and saves one record; true once saved. Failing checks leave their messages
 * and questions for the form's fields to show.
 */
export function useRecordCheck<E extends SyncEntity>(entity: E, units: UnitSystem) {
  useRecordChecksOnFirstUse();
  // The messages on screen by field path ("" for the record as a whole).
  const [messages, setMessages] = useState<Record<string, string>>({});
  const [asks, setAsks] = useState<Unusual[]>([]);
  const [confirmed, setConfirmed] = useState<string[]>([]);

  const check: RecordCheck = {
    errorAt: (path, under = false) => {
      const direct = messages[path];
      if (direct || !under) return direct;
      return Object.entries(messages).find(([p]) => isUnder(p, path))?.[1];
    },
    askAt: (path, under = false) => asks.filter((u) => (under ? isUnder(u.path, path) : u.path === path)),
    confirm: (code) => {
      setConfirmed((list) => [...list, code]);
      setAsks((list) => list.filter((u) => u.code !== code));
    },
    unplaced: (shown) =>
      Object.entries(messages)
        .filter(([p]) => !shown.some((s) => isUnder(p, s)))
        .map(([, m]) => m),
    clear: () => {
      setMessages({});
      setAsks([]);
      setConfirmed([]);
    },
  };

  async function save(id: string, fields: EntityFields<E>): Promise<boolean> {
    let checks;
    let saveRecord;
    try {
      // The outbox (and Dexie with it) loads at the first save, not with the screen.
      [checks, { saveRecord }] = await Promise.all([loadRecordChecks(), import('@/lib/client/outbox')]);
    } catch {
      setMessages((shown) => ({ ...shown, '': CHECKS_MISSING }));
      return false;
    }
    const { recordResolver, unusualIn, withConfirmations } = checks;
    // No form fields are registered, so the resolver is asked about the whole record.
    const { errors } = await recordResolver(entity, units)(fields as FieldValues, undefined, { fields: {}, names: [], shouldUseNativeValidation: false });
    const found = collect(errors);
    setMessages(found);
    if (Object.keys(found).length > 0) {
      setAsks([]);
      return false;
    }
    const record = withConfirmations(entity, fields, confirmed);
    const open = unusualIn(entity, record, units).filter((u) => !u.confirmed);
    setAsks(open);
    if (open.length > 0) return false;
    try {
      await saveRecord(entity, id, record as Partial<EntityFields<E>>, units);
    } catch (error) {
      if (!(error instanceof RecordRefused)) throw error;
      setMessages({ ...error.messages });
      setAsks(error.unusual);
      return false;
    }
    setMessages({});
    setConfirmed([]);
    return true;
  }

  return { check, save };
}

/** The message and any "is this right?" question for one field, shown under it. */
export function FieldIssue({ check, path, under = false }: { check: RecordCheck; path: string; under?: boolean }) {
  const message = check.errorAt(path, under);
  const asks = check.askAt(path, under);
  if (!message && asks.length === 0) return null;
  return (
    <div className="mt-1 space-y-2" data-field-issue={path}>
      {message && (
        <p role="alert" className="font-bold text-clay">
          {message}
        </p>
      )}
      {asks.map((u) => (
        <Card tone="caution" padding="md" key={u.code} role="alert">
          <p className="font-bold">{u.message}</p>
          <Button variant="secondary" className="mt-2" onClick={() => check.confirm(u.code)}>
            Yes, this is right
          </Button>
        </Card>
      ))}
    </div>
  );
}
