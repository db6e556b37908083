'use client';

import { useEffect, useState } from 'react';
import { Card } from '@/components/ui/card';
import { setDirty } from '@/lib/client/dirty';
import { newId } from '@/lib/client/ids';
import { announceSave } from '@/lib/client/sync/triggers';
import type { UnitSystem } from '@/lib/shared/domain';
import { showQuantity } from '@/lib/shared/display/quantities';
import { Choice, PrimaryButton } from '../../../_components/choice';
import { NumberField } from '../../../_components/number-field';
import { FieldIssue, useRecordCheck } from '../../../_components/record-check';
import { ProfileChart } from './profile-chart';
import { RowEditor, type Column, type Row } from './row-editor';
import { buildRun, liveResult, type RunMethod } from './run-builders';

const METHODS = [
  { value: 'level', label: 'Level and staff' },
  { value: 'hose', label: 'Hose level' },
  { value: 'clinometer', label: 'Clinometer' },
  { value: 'gps', label: 'GPS (rough)' },
  { value: 'barometric', label: 'Barometer (rough)' },
] as const;
const LIFT_METHODS = [...METHODS, { value: 'direct', label: 'One figure' }] as const;

const LEVEL: (i: number, n: number) => Column[] = (i, n) => [
  ...(i > 0 ? [{ key: 'foresightM', label: 'Foresight', quantity: 'length' as const }] : []),
  ...(i < n - 1 ? [{ key: 'backsightM', label: 'Backsight', quantity: 'length' as const }] : []),
];
const HOSE: Column[] = [
  { key: 'upperReadingM', label: 'Reading at the upper end', quantity: 'length' },
  { key: 'lowerReadingM', label: 'Reading at the lower end', quantity: 'length' },
];
const CLINO: Column[] = [
  { key: 'slopeDistanceM', label: 'Slope distance', quantity: 'length' },
  { key: 'angleBelowHorizontalDeg', label: 'Angle below horizontal (− if uphill)', quantity: 'angle', signed: true },
];

export function FallForm({ visitId, purpose, units }: { visitId: string; purpose: 'fall' | 'lift'; units: UnitSystem }) {
  const [method, setMethod] = useState<RunMethod>('level');
  const [rows, setRows] = useState<Row[]>([{}, {}]);
  const [single, setSingle] = useState<Row>({});
  const [bookedFrom, setBookedFrom] = useState<'pump' | 'tank'>('pump');
  const [message, setMessage] = useState<string | null>(null);
  const { check, save: saveChecked } = useRecordCheck('fallReading', units);

  const run = buildRun(method, rows, single, 'level');
  const live = liveResult(run);
  const typed = rows.some((r) => Object.values(r).some((v) => v !== undefined)) || Object.keys(single).length > 0;
  useEffect(() => {
    setDirty(`fall-${purpose}`, typed);
    return () => setDirty(`fall-${purpose}`, false);
  }, [typed, purpose]);

  async function save() {
    setMessage(null);
    if (!run) {
      setMessage('Fill in every reading of the run first.');
      return;
    }
    // Dexie loads at the first save, not with the screen (the runs on screen come from the field worker).
    const { fieldDb } = await import('@/lib/client/db');
    const seq = await fieldDb().fallReadings.where('visitId').equals(visitId).count();
    const saved = await saveChecked(newId(), {
      visitId,
      purpose,
      seq,
      takenAt: new Date().toISOString(),
      notes: '',
      bookedFrom: purpose === 'lift' ? bookedFrom : null,
      run,
    });
    if (!saved) {
      setMessage('Not saved yet: see the note at the reading above.');
      return;
    }
    check.clear();
    setRows([{}, {}]);
    setSingle({});
    setMessage('Run saved on this phone.');
    announceSave();
  }

  const setOne = (key: string) => (v: number | undefined) => setSingle((s) => ({ ...s, [key]: v }));
  const rowIssue = (key: 'rows' | 'steps' | 'legs') =>
    function RowIssue(i: number, column: string) {
      return <FieldIssue check={check} path={`run.${key}.${i}.${column}`} />;
    };
  const single_ = (key: string) => <FieldIssue check={check} path={`run.${key}`} />;
  return (
    <div className="space-y-4">
      <Choice
        label="Method"
        options={purpose === 'lift' ? LIFT_METHODS : METHODS}
        value={method}
        onChange={(m) => {
          setMethod(m);
          setRows(m === 'level' ? [{}, {}] : [{}]);
          setSingle({});
          check.clear();
        }}
      />
      {purpose === 'lift' && method !== 'direct' && (
        <Choice
          label="Booked from"
          options={
            [
              { value: 'pump', label: 'Pump, going up' },
              { value: 'tank', label: 'Tank, going down' },
            ] as const
          }
          value={bookedFrom}
          onChange={setBookedFrom}
        />
      )}
      {method === 'level' && (
        <RowEditor
          rows={rows}
          columns={LEVEL}
          units={units}
          onChange={setRows}
          addLabel="Add a change point"
          issueAt={rowIssue('rows')}
          title={(i, n) => (i === 0 ? 'First station (start)' : i === n - 1 ? `Station ${i + 1} (end)` : `Change point ${i}`)}
        />
      )}
      {method === 'hose' && (
        <RowEditor
          rows={rows}
          columns={() => HOSE}
          units={units}
          onChange={setRows}
          addLabel="Add a hose step"
          title={(i) => `Step ${i + 1}`}
          issueAt={rowIssue('steps')}
        />
      )}
      {method === 'clinometer' && (
        <RowEditor
          rows={rows}
          columns={() => CLINO}
          units={units}
          onChange={setRows}
          addLabel="Add a leg"
          title={(i) => `Leg ${i + 1}`}
          issueAt={rowIssue('legs')}
        />
      )}
      {method === 'gps' && (
        <div className="grid gap-3">
          <NumberField label="Altitude at the start" quantity="length" units={units} value={single.startAltitudeM} onChange={setOne('startAltitudeM')}>
            {single_('startAltitudeM')}
          </NumberField>
          <NumberField label="Altitude at the end" quantity="length" units={units} value={single.endAltitudeM} onChange={setOne('endAltitudeM')}>
            {single_('endAltitudeM')}
          </NumberField>
          <NumberField
            label="Horizontal accuracy shown by the phone"
            quantity="length"
            units={units}
            value={single.horizontalAccuracyM}
            onChange={setOne('horizontalAccuracyM')}
          >
            {single_('horizontalAccuracyM')}
          </NumberField>
        </div>
      )}
      {method === 'barometric' && (
        <div className="grid gap-3">
          <NumberField label="Pressure at the start" quantity="pressureHPa" units={units} value={single.startPressureHPa} onChange={setOne('startPressureHPa')}>
            {single_('startPressureHPa')}
          </NumberField>
          <NumberField label="Pressure at the end" quantity="pressureHPa" units={units} value={single.endPressureHPa} onChange={setOne('endPressureHPa')}>
            {single_('endPressureHPa')}
          </NumberField>
        </div>
      )}
      {method === 'direct' && (
        <NumberField label="Height of the tank above the pump" quantity="length" units={units} value={single.staticLiftM} onChange={setOne('staticLiftM')}>
          {single_('staticLiftM')}
        </NumberField>
      )}
      {method !== 'direct' && (
        <Card tone="creek" padding="md" aria-live="polite" data-testid="fall-live">
          <p className="text-lg font-bold">
            {purpose === 'fall' ? 'Fall' : 'Height change'} so far: <span className="figure">{showQuantity(live.dropM, 'length', units)}</span>
          </p>
          {live.checkOk !== null && (
            <p className={live.checkOk ? 'font-bold text-moss' : 'font-bold text-clay'}>
              {live.checkOk ? 'Booking check: Σ backsights − Σ foresights agrees ✓' : 'Booking check fails: re-read the last staff readings'}
            </p>
          )}
          {live.message && <p className="text-stone">{live.message}</p>}
        </Card>
      )}
      <FieldIssue check={check} path="run.result" />
      <FieldIssue check={check} path="run" />
      <ProfileChart levelsM={live.levelsM} units={units} />
      {message && (
        <p role="status" className="font-bold">
          {message}
        </p>
      )}
      <PrimaryButton onClick={save}>Save this run</PrimaryButton>
    </div>
  );
}
