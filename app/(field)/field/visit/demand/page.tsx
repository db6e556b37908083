'use client';

import { useFieldQuery } from '../../_components/use-field-query';
import { Suspense, useEffect, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Select } from '@/components/ui/control';
import { DEMAND_CATALOGUE, type DemandKind } from '@/lib/engine/demand';
import { SOURCES } from '@/lib/engine/sources';
import { fieldDb } from '@/lib/client/db';
import { setDirty } from '@/lib/client/dirty';
import { newId } from '@/lib/client/ids';
import { getMeta } from '@/lib/client/sync/meta';
import { announceSave } from '@/lib/client/sync/triggers';
import { formatWhole } from '@/lib/shared/display/numbers';
import { showQuantity } from '@/lib/shared/display/quantities';
import type { UnitSystem } from '@/lib/shared/domain';
import type { PullResponse } from '@/lib/shared/schemas/sync';
import { PrimaryButton, SectionHeader } from '../../_components/choice';
import { NumberField } from '../../_components/number-field';
import { FieldIssue, useRecordCheck } from '../../_components/record-check';
import { useVisit, useVisitId } from '../../_components/use-field-data';
import { WithUnits } from '../../_components/with-units';
import { useUndoableDelete } from '../../_components/undo-delete';

const KINDS = Object.values(DEMAND_CATALOGUE);

/** The citation of a figure's source, shortened to its first clause. */
function sourceName(id: string): string {
  const source = (SOURCES as Record<string, { citation: string } | undefined>)[id];
  return source ? source.citation.split(/[,(]/)[0]!.trim() : id;
}

const GARDEN = 'garden-m2';

/** A line as read: "4 × Person, tap on the plot", or a garden by its area in the reader's units. */
function lineName(kind: string, count: number, units: UnitSystem): string {
  if (kind === GARDEN) return `Garden, ${showQuantity(count, 'area', units)}`;
  return `${formatWhole(count)} × ${DEMAND_CATALOGUE[kind as DemandKind]?.label ?? 'Other need'}`;
}

/** What one head (or one square metre of garden) needs a day, in the reader's units. */
function perHeadText(kind: string, litres: number, units: UnitSystem): string {
  return kind === GARDEN ? showQuantity(litres, 'litresPerArea', units) : `${showQuantity(litres, 'litresPerHead', units)} each`;
}

function DemandPage({ units }: { units: UnitSystem }) {
  const visitId = useVisitId();
  const { remove, bar } = useUndoableDelete();
  const data = useVisit(visitId);
  const farmId = data?.visit.farmId ?? '';
  const lines = useFieldQuery(
    async () => (farmId ? (await fieldDb().demandLines.where('farmId').equals(farmId).toArray()).filter((l) => !l.deletedAt) : []),
    [farmId],
  );
  const overrides = useFieldQuery(async () => (await getMeta<PullResponse['settings']>('settings'))?.demandFigures ?? {}, [], {} as Record<string, number>);
  const [kind, setKind] = useState<DemandKind>('person-tap-on-plot');
  const [typedCount, setCount] = useState<number | undefined>();
  // A garden's area is kept in whole square metres, whatever unit it was typed in.
  const count = kind === GARDEN && typedCount !== undefined ? Math.round(typedCount) : typedCount;
  const [perHead, setPerHead] = useState<number | undefined>();
  const [message, setMessage] = useState<string | null>(null);
  const { check, save } = useRecordCheck('demandLine', units);
  const typed = count !== undefined || perHead !== undefined;
  useEffect(() => {
    setDirty('demand', typed);
    return () => setDirty('demand', false);
  }, [typed]);
  const entry = DEMAND_CATALOGUE[kind];
  const defaultFigure = overrides[kind] ?? entry.litresPerHeadPerDay;
  const total = (lines ?? []).reduce((sum, l) => sum + l.count * l.litresPerHeadPerDay, 0);

  async function add() {
    if (!farmId) return;
    setMessage(null);
    const figure = perHead ?? defaultFigure;
    const saved = await save(newId(), {
      farmId,
      kind,
      count: count as number,
      litresPerHeadPerDay: figure,
      figureSource: perHead === undefined ? (overrides[kind] !== undefined ? 'organisation figure' : entry.sourceId) : 'advisor on site',
      note: '',
      confirmed: null,
    });
    if (!saved) {
      setMessage('Not saved yet: see the note at the field above.');
      return;
    }
    setCount(undefined);
    setPerHead(undefined);
    setMessage('Line saved on this phone.');
    announceSave();
  }

  return (
    <div className="space-y-5">
      <SectionHeader visitId={visitId} title="Water needed" />
      <p className="text-lg">
        Daily need on this farm:{' '}
        <strong className="figure" data-testid="demand-total">
          {showQuantity(total, 'litresPerDay', units)}
        </strong>
      </p>
      <Card as="ul" padding="none" className="divide-y divide-rule">
        {lines?.map((l) => (
          <li key={l.id} className="flex items-center justify-between px-3 py-2">
            <span>
              <span className="block font-bold">{lineName(l.kind, l.count, units)}</span>
              <span className="figure block">
                {perHeadText(l.kind, l.litresPerHeadPerDay, units)} · {sourceName(l.figureSource)}
              </span>
            </span>
            <Button variant="quiet" size="sm" onClick={() => remove('demandLine', l.id, 'the line')}>
              Delete
            </Button>
          </li>
        ))}
      </Card>
      {bar}
      <Card as="section" tone="field" padding="md" className="space-y-3" aria-labelledby="add-line">
        <h2 id="add-line" className="text-xl font-bold">
          Add a line
        </h2>
        <label htmlFor="kind" className="block font-bold">
          Who or what drinks
        </label>
        <Select
          id="kind"
          value={kind}
          onChange={(e) => {
            setKind(e.target.value as DemandKind);
            setPerHead(undefined);
            check.clear();
          }}
          look="phone"
          className="text-lg"
        >
          {KINDS.map((k) => (
            <option key={k.kind} value={k.kind}>
              {k.kind === GARDEN ? 'Garden' : k.label}
            </option>
          ))}
        </Select>
        {kind === GARDEN ? (
          <NumberField label="Garden area" quantity="area" units={units} value={typedCount} onChange={setCount}>
            <FieldIssue check={check} path="count" />
          </NumberField>
        ) : (
          <NumberField
            label={entry.unit === 'person' ? 'How many people' : entry.unit === 'bird' ? 'How many birds' : 'How many head'}
            quantity="count"
            units={units}
            value={count}
            onChange={setCount}
          >
            <FieldIssue check={check} path="count" />
          </NumberField>
        )}
        <NumberField
          label={kind === GARDEN ? `Water per ${units === 'us' ? 'square foot' : 'square metre'} a day` : `Water per ${entry.unit} a day`}
          quantity={kind === GARDEN ? 'litresPerArea' : 'litresPerHead'}
          units={units}
          value={perHead ?? defaultFigure}
          onChange={setPerHead}
          hint={`Default ${kind === GARDEN ? showQuantity(defaultFigure, 'litresPerArea', units) : showQuantity(defaultFigure, 'litresPerHead', units)} — ${overrides[kind] !== undefined ? "your organisation's figure" : sourceName(entry.sourceId)}`}
        >
          <FieldIssue check={check} path="litresPerHeadPerDay" />
        </NumberField>
        {message && (
          <p role="status" className="font-bold">
            {message}
          </p>
        )}
        <PrimaryButton onClick={add}>Add line</PrimaryButton>
      </Card>
    </div>
  );
}

export default function Page() {
  return (
    <Suspense>
      <WithUnits title="Water needed">{(units) => <DemandPage units={units} />}</WithUnits>
    </Suspense>
  );
}
