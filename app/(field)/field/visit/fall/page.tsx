'use client';

import { useFieldQuery } from '../../_components/use-field-query';
import { Suspense, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { showQuantity } from '@/lib/shared/display/quantities';
import { FALL_METHOD_WORDS, wordFor } from '@/lib/shared/reading-words';
import { Choice, SectionHeader } from '../../_components/choice';
import { useVisitId } from '../../_components/use-field-data';
import { WithUnits } from '../../_components/with-units';
import type { UnitSystem } from '@/lib/shared/domain';
import { useUndoableDelete } from '../../_components/undo-delete';
import { FallForm } from './_components/fall-form';
import { liveResult } from './_components/run-builders';

function FallPage({ units }: { units: UnitSystem }) {
  const visitId = useVisitId();
  const { remove, bar } = useUndoableDelete();
  const [purpose, setPurpose] = useState<'fall' | 'lift'>('fall');
  const saved = useFieldQuery('fallReadings', visitId);
  return (
    <div className="space-y-5">
      <SectionHeader visitId={visitId} title="Fall and lift" />
      <Choice
        label="What are you measuring?"
        value={purpose}
        onChange={setPurpose}
        options={
          [
            { value: 'fall', label: 'Fall: intake → pump' },
            { value: 'lift', label: 'Lift: pump → tank' },
          ] as const
        }
      />
      <FallForm key={purpose} visitId={visitId} purpose={purpose} units={units} />
      <section aria-labelledby="saved-runs" className="space-y-2">
        <h2 id="saved-runs" className="text-xl font-bold">
          Saved runs
        </h2>
        {saved?.length === 0 && <p className="text-stone">None yet.</p>}
        <Card as="ul" padding="none" className="divide-y divide-rule">
          {saved?.map((r) => {
            const drop = r.run.method === 'direct' ? r.run.staticLiftM : liveResult(r.run).dropM;
            return (
              <li key={r.id} className="flex items-center justify-between px-3 py-2">
                <span>
                  <span className="block font-bold">
                    {r.purpose === 'fall' ? 'Fall' : r.bookedFrom === 'tank' ? 'Lift, booked down from the tank' : 'Lift'} ·{' '}
                    {wordFor(FALL_METHOD_WORDS, r.run.method)}
                  </span>
                  <span className="figure block">{showQuantity(drop === null ? null : Math.abs(drop), 'length', units)}</span>
                </span>
                <Button variant="quiet" size="sm" onClick={() => remove('fallReading', r.id, r.purpose === 'fall' ? 'the fall run' : 'the lift run')}>
                  Delete
                </Button>
              </li>
            );
          })}
        </Card>
        {bar}
      </section>
    </div>
  );
}

export default function Page() {
  return (
    <Suspense>
      <WithUnits title="Fall and lift">{(units) => <FallPage units={units} />}</WithUnits>
    </Suspense>
  );
}
