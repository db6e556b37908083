'use client';

import { useFieldQuery } from '../../_components/use-field-query';
import { Suspense, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Input } from '@/components/ui/control';
import type { LocalRecord } from '@/lib/client/db';
import { newId } from '@/lib/client/ids';
import { announceSave } from '@/lib/client/sync/triggers';
import { floatFlowLps, summarise, vNotchFlowLps, volumetricFlowLps } from '@/lib/engine/flow';
import type { UnitSystem } from '@/lib/shared/domain';
import { formatCount } from '@/lib/shared/display/numbers';
import { showQuantity } from '@/lib/shared/display/quantities';
import { FLOW_METHOD_WORDS, SEASON_WORDS, wordFor } from '@/lib/shared/reading-words';
import type { FlowMeasurement } from '@/lib/shared/schemas/site-readings';
import { SectionHeader } from '../../_components/choice';
import { useUnits, useVisitId } from '../../_components/use-field-data';
import { useUndoableDelete } from '../../_components/undo-delete';
import { FlowForm } from './_components/flow-form';

function meanLps(m: FlowMeasurement): number | null {
  try {
    const flows =
      m.method === 'volumetric'
        ? m.trials.map((t) => volumetricFlowLps([t]))
        : m.method === 'v-notch'
          ? m.trials.map((t) => vNotchFlowLps(t.headM, m.notchAngleDeg))
          : m.method === 'float'
            ? m.trials.map((t) => floatFlowLps({ ...t, areaM2: m.areaM2, coefficient: m.coefficient }))
            : [];
    return flows.length ? summarise(flows, 'flow').mean : null;
  } catch {
    return null;
  }
}

function SourceName({ visitId, source, units }: { visitId: string; source: LocalRecord<'waterSource'> | null; units: UnitSystem }) {
  const [name, setName] = useState('');
  if (source) {
    return (
      <>
        <p className="text-lg">
          Source: <strong>{source.name}</strong> ({source.kind})
        </p>
        <FlowForm visitId={visitId} sourceId={source.id} units={units} />
      </>
    );
  }
  return (
    <form
      className="space-y-3"
      onSubmit={async (e) => {
        e.preventDefault();
        // The outbox (and Dexie with it) loads at the first save, not with the screen.
        const { saveRecord } = await import('@/lib/client/outbox');
        await saveRecord('waterSource', newId(), { visitId, name: name.trim() || 'Main source', kind: 'creek', notes: '' });
        announceSave();
      }}
    >
      <label htmlFor="source-name" className="block font-bold">
        Name of the source (spring, creek…)
      </label>
      <Input look="phone" id="source-name" value={name} onChange={(e) => setName(e.target.value)} />
      <Button size="wide" className="min-h-14 text-xl" type="submit">
        Start measuring this source
      </Button>
    </form>
  );
}

function FlowPage() {
  const visitId = useVisitId();
  const units = useUnits();
  const { remove, bar } = useUndoableDelete();
  // Undefined before the phone's first sync run (the source may be on its way), null once none came.
  const source = useFieldQuery('flowSource', visitId);
  const saved = useFieldQuery('flowMeasurements', visitId);
  // The form and the saved list are drawn together once both are read and the reader's units are
  // known, so neither pushes the other down and nothing is typed against labels in the wrong units.
  if (units === undefined || source === undefined || saved === undefined) {
    return (
      <div className="space-y-5">
        <SectionHeader visitId={visitId} title="Source and flow" />
        <p className="text-lg">Reading the phone…</p>
      </div>
    );
  }
  return (
    <div className="space-y-5">
      <SectionHeader visitId={visitId} title="Source and flow" />
      <SourceName visitId={visitId} source={source} units={units} />
      <section aria-labelledby="saved-flows" className="space-y-2">
        <h2 id="saved-flows" className="text-xl font-bold">
          Saved measurements
        </h2>
        {saved.length === 0 && <p className="text-stone">None yet.</p>}
        <Card as="ul" padding="none" className="divide-y divide-rule">
          {saved.map((m) => (
            <li key={m.id} className="flex items-center justify-between px-3 py-2">
              <span>
                <span className="block font-bold">
                  {wordFor(FLOW_METHOD_WORDS, m.measurement.method)} · {wordFor(SEASON_WORDS, m.measurement.season)}
                </span>
                <span className="figure block">
                  {showQuantity(meanLps(m.measurement), 'flowLps', units)} mean of {formatCount(m.measurement.trials.length, 'trial')}
                </span>
              </span>
              <Button variant="quiet" size="sm" onClick={() => remove('flowMeasurement', m.id, 'the flow measurement')}>
                Delete
              </Button>
            </li>
          ))}
        </Card>
        {bar}
      </section>
    </div>
  );
}

export default function Page() {
  return (
    <Suspense>
      <FlowPage />
    </Suspense>
  );
}
