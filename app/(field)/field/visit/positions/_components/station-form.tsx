'use client';

import { useEffect, useState } from 'react';
import { Card } from '@/components/ui/card';
import { fixFields, watchFix, type Fix } from '@/lib/client/geolocation';
import { newId } from '@/lib/client/ids';
import { announceSave } from '@/lib/client/sync/triggers';
import type { UnitSystem } from '@/lib/shared/domain';
import { showQuantity } from '@/lib/shared/display/quantities';
import { PrimaryButton } from '../../../_components/choice';
import { NumberField } from '../../../_components/number-field';
import { FieldIssue, useRecordCheck } from '../../../_components/record-check';

/**
 * Adds one profile station: distance along the bank, levelled reduced level, and whether it floods.
 * While the form is open the phone watches its position, and each station is booked with the latest
 * fix (and its accuracy); with no fix the station is booked without a position, never held up.
 */
export function StationForm({ visitId, units }: { visitId: string; units: UnitSystem }) {
  const [chainageM, setChainageM] = useState<number | undefined>();
  const [levelM, setLevelM] = useState<number | undefined>();
  const [floods, setFloods] = useState(false);
  const [noIntake, setNoIntake] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const [fix, setFix] = useState<Fix | null>(null);
  const [fixProblem, setFixProblem] = useState<string | null>(null);
  const { check, save: saveChecked } = useRecordCheck('point', units);

  useEffect(
    () =>
      watchFix((f) => {
        setFix(f);
        setFixProblem(null);
      }, setFixProblem),
    [],
  );

  async function save() {
    if (chainageM === undefined || levelM === undefined) {
      setMessage('A station needs its distance along the bank and its level.');
      return;
    }
    const flags = [...(noIntake ? ['no-intake' as const] : []), ...(floods ? ['no-pump-site' as const] : [])];
    const position = fixFields(fix);
    const saved = await saveChecked(newId(), {
      visitId,
      role: 'station',
      label: '',
      ...position,
      chainageM,
      reducedLevelM: levelM,
      flags,
      capturedAt: new Date().toISOString(),
    });
    if (!saved) {
      setMessage('Not saved yet: see the note at the field above.');
      return;
    }
    setChainageM(undefined);
    setLevelM(undefined);
    setFloods(false);
    setNoIntake(false);
    setMessage(
      position.lat === null
        ? 'Station saved on this phone, without a position (placed by chainage on the map).'
        : 'Station saved on this phone, with its position.',
    );
    announceSave();
  }

  const toggle = (on: boolean, set: (v: boolean) => void, label: string) => (
    <button
      type="button"
      aria-pressed={on}
      onClick={() => set(!on)}
      className={`min-h-12 rounded-md border-2 px-4 font-bold ${on ? 'border-clay bg-clay text-white' : 'border-stone bg-white text-ink'}`}
    >
      {label}
    </button>
  );

  return (
    <Card as="fieldset" tone="field" padding="md" className="space-y-3">
      <legend className="px-1 text-xl font-bold">Add a station</legend>
      <div className="grid gap-3 sm:grid-cols-2">
        <NumberField label="Distance along the bank from the top" quantity="length" units={units} value={chainageM} onChange={setChainageM}>
          <FieldIssue check={check} path="chainageM" />
        </NumberField>
        <NumberField label="Level (reduced level)" quantity="length" units={units} signed value={levelM} onChange={setLevelM}>
          <FieldIssue check={check} path="reducedLevelM" />
        </NumberField>
      </div>
      <div className="flex flex-wrap gap-2">
        {toggle(floods, setFloods, 'Floods: no ram here')}
        {toggle(noIntake, setNoIntake, 'No intake here')}
      </div>
      <p className="text-stone" data-testid="station-fix" aria-live="polite">
        {fix ? (
          <>
            Position from the phone, <span className="figure">± {showQuantity(fix.accuracyM, 'length', units)}</span>: saved with the station.
          </>
        ) : (
          `${fixProblem ? 'No position from the phone (location off, blocked or no open sky).' : 'Waiting for a position fix.'} Stations are saved without one meanwhile.`
        )}
      </p>
      {message && (
        <p role="status" className="font-bold">
          {message}
        </p>
      )}
      <PrimaryButton onClick={save}>Save station</PrimaryButton>
    </Card>
  );
}
