'use client';

import { useState } from 'react';
import { newId } from '@/lib/client/ids';
import { saveRecord } from '@/lib/client/outbox';
import { announceSave } from '@/lib/client/sync/triggers';
import type { UnitSystem } from '@/lib/shared/domain';
import { PrimaryButton } from '../../../_components/choice';
import { NumberField } from '../../../_components/number-field';

/** Adds one profile station: distance along the bank, levelled reduced level, and whether it floods. */
export function StationForm({ visitId, units }: { visitId: string; units: UnitSystem }) {
  const [chainageM, setChainageM] = useState<number | undefined>();
  const [levelM, setLevelM] = useState<number | undefined>();
  const [floods, setFloods] = useState(false);
  const [noIntake, setNoIntake] = useState(false);
  const [message, setMessage] = useState<string | null>(null);

  async function save() {
    if (chainageM === undefined || levelM === undefined) {
      setMessage('A station needs its distance along the bank and its level.');
      return;
    }
    const flags = [...(noIntake ? ['no-intake' as const] : []), ...(floods ? ['no-pump-site' as const] : [])];
    await saveRecord('point', newId(), {
      visitId, role: 'station', label: '', lat: null, lon: null, accuracyM: null, altitudeM: null, altitudeAccuracyM: null,
      chainageM, reducedLevelM: levelM, flags, capturedAt: new Date().toISOString(),
    });
    setChainageM(undefined); setLevelM(undefined); setFloods(false); setNoIntake(false);
    setMessage('Station saved on this phone.');
    announceSave();
  }

  const toggle = (on: boolean, set: (v: boolean) => void, label: string) => (
    <button type="button" aria-pressed={on} onClick={() => set(!on)}
      className={`min-h-12 rounded-md border-2 px-4 font-bold ${on ? 'border-clay bg-clay text-white' : 'border-stone bg-white text-ink'}`}>{label}</button>
  );

  return (
    <fieldset className="space-y-3 rounded-md border-2 border-rule bg-white p-3">
      <legend className="px-1 text-xl font-bold">Add a station</legend>
      <div className="grid gap-3 sm:grid-cols-2">
        <NumberField label="Distance along the bank from the top" quantity="length" units={units} value={chainageM} onChange={setChainageM} />
        <NumberField label="Level (reduced level)" quantity="length" units={units} signed value={levelM} onChange={setLevelM} />
      </div>
      <div className="flex flex-wrap gap-2">
        {toggle(floods, setFloods, 'Floods: no ram here')}
        {toggle(noIntake, setNoIntake, 'No intake here')}
      </div>
      {message && <p role="status" className="font-bold">{message}</p>}
      <PrimaryButton onClick={save}>Save station</PrimaryButton>
    </fieldset>
  );
}
