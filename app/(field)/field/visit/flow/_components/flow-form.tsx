'use client';

import { useEffect, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { floatFlowLps, summarise, vNotchFlowLps, volumetricFlowLps } from '@/lib/engine/flow';
import { newId } from '@/lib/client/ids';
import { setDirty } from '@/lib/client/dirty';
import { announceSave } from '@/lib/client/sync/triggers';
import type { UnitSystem } from '@/lib/shared/domain';
import { showQuantity } from '@/lib/shared/display/quantities';
import { loadRecordChecks } from '@/lib/client/load-record-checks';
import type { FlowMeasurement } from '@/lib/shared/schemas/site-readings';
import { Choice, PrimaryButton } from '../../../_components/choice';
import { NumberField } from '../../../_components/number-field';
import { FieldIssue, useRecordCheck } from '../../../_components/record-check';
import { Stopwatch } from './stopwatch';
import { TrialList } from './trial-list';

type Method = 'volumetric' | 'v-notch' | 'float';
type Season = 'dry' | 'wet' | 'unknown';

const METHODS = [
  { value: 'volumetric', label: 'Bucket' },
  { value: 'v-notch', label: 'V-notch weir' },
  { value: 'float', label: 'Float' },
] as const;
const SEASONS = [
  { value: 'dry', label: 'Dry season' },
  { value: 'wet', label: 'Wet season' },
  { value: 'unknown', label: 'Not sure' },
] as const;

/** What the shared schema says of one trial before it is added (in the advisor's units), or null. */
async function trialProblem(candidate: FlowMeasurement, key: string, units: UnitSystem): Promise<string | null> {
  const { flowMeasurementSchema, messagesByPath } = await loadRecordChecks();
  const parsed = flowMeasurementSchema.safeParse(candidate);
  if (parsed.success) return null;
  const messages = messagesByPath(
    parsed.error.issues.filter((i) => i.path[0] === 'trials' && i.path[2] === key),
    units,
  );
  return Object.values(messages)[0] ?? null;
}

/** Safely computes a live figure; the engine throws on readings that are not finished yet. */
function attempt(fn: () => number[]): number[] {
  try {
    return fn();
  } catch {
    return [];
  }
}

export function FlowForm({ visitId, sourceId, units }: { visitId: string; sourceId: string | null; units: UnitSystem }) {
  const [method, setMethod] = useState<Method>('volumetric');
  const [season, setSeason] = useState<Season>('dry');
  const [bucketL, setBucketL] = useState<number | undefined>(20);
  const [typedSeconds, setTypedSeconds] = useState<number | undefined>();
  const [seconds, setSeconds] = useState<number[]>([]);
  const [heads, setHeads] = useState<number[]>([]);
  const [typedHead, setTypedHead] = useState<number | undefined>();
  const [distanceM, setDistanceM] = useState<number | undefined>();
  const [areaM2, setAreaM2] = useState<number | undefined>();
  const [message, setMessage] = useState<string | null>(null);
  const [addProblem, setAddProblem] = useState<string | null>(null);
  const { check, save: saveChecked } = useRecordCheck('flowMeasurement', units);

  const count = method === 'v-notch' ? heads.length : seconds.length;
  useEffect(() => {
    setDirty('flow', count > 0);
    return () => setDirty('flow', false);
  }, [count]);

  const flows = attempt(() => {
    if (method === 'volumetric' && bucketL) return seconds.map((s) => volumetricFlowLps([{ volumeL: bucketL, seconds: s }]));
    if (method === 'v-notch') return heads.map((h) => vNotchFlowLps(h));
    if (method === 'float' && distanceM && areaM2) return seconds.map((s) => floatFlowLps({ distanceM, seconds: s, areaM2 }));
    return [];
  });
  const stats = flows.length ? summarise(flows, 'flow') : null;

  function measurement(): FlowMeasurement | null {
    if (method === 'volumetric' && bucketL && seconds.length) return { method, season, trials: seconds.map((s) => ({ volumeL: bucketL, seconds: s })) };
    if (method === 'v-notch' && heads.length) return { method, season, notchAngleDeg: 90, trials: heads.map((headM) => ({ headM })) };
    if (method === 'float' && distanceM && areaM2 && seconds.length)
      return { method, season, areaM2, coefficient: 0.85, trials: seconds.map((s) => ({ distanceM, seconds: s })) };
    return null;
  }

  async function save() {
    setMessage(null);
    const m = measurement();
    if (!m) {
      setMessage(
        method === 'v-notch'
          ? 'Add at least one head reading first.'
          : method === 'float'
            ? 'Fill in the run length and the cross-section, then time at least one float.'
            : 'Add at least one trial first: tap start when the bucket goes under, stop when it is full.',
      );
      return;
    }
    const saved = await saveChecked(newId(), { visitId, sourceId, takenAt: new Date().toISOString(), notes: '', measurement: m });
    if (!saved) {
      setMessage('Not saved yet: see the note at the field above.');
      return;
    }
    setSeconds([]);
    setHeads([]);
    setMessage(`Saved ${m.trials.length} trial${m.trials.length === 1 ? '' : 's'} on this phone.`);
    announceSave();
  }

  // Each trial is checked against the shared schema as it is added; a refused one stays out of the list.
  const addSeconds = async (s: number | undefined) => {
    if (s === undefined) {
      setAddProblem('Type the seconds first.');
      return;
    }
    const trial = method === 'float' ? { distanceM: 1, seconds: s } : { volumeL: 1, seconds: s };
    const candidate = (
      method === 'float' ? { method, season, areaM2: 1, coefficient: 0.85, trials: [trial] } : { method: 'volumetric', season, trials: [trial] }
    ) as FlowMeasurement;
    const problem = await trialProblem(candidate, 'seconds', units);
    setAddProblem(problem);
    if (!problem) setSeconds((list) => [...list, s]);
  };
  const addHead = async (h: number | undefined) => {
    if (h === undefined) {
      setAddProblem('Type the head first.');
      return;
    }
    const problem = await trialProblem({ method: 'v-notch', season, notchAngleDeg: 90, trials: [{ headM: h }] }, 'headM', units);
    setAddProblem(problem);
    if (!problem) {
      setHeads((l) => [...l, h]);
      setTypedHead(undefined);
    }
  };
  // The trial's own reading (the bucket's volume, the same for every trial, has its note at the bucket field).
  const trialIssue = (i: number) => <FieldIssue check={check} path={`measurement.trials.${i}.${method === 'v-notch' ? 'headM' : 'seconds'}`} />;

  return (
    <div className="space-y-4">
      <Choice
        label="Method"
        options={METHODS}
        value={method}
        onChange={(m) => {
          setMethod(m);
          setSeconds([]);
          setHeads([]);
          check.clear();
          setAddProblem(null);
        }}
      />
      <Choice label="Season of this reading" options={SEASONS} value={season} onChange={setSeason} />
      {method === 'volumetric' && (
        <>
          <NumberField label="Bucket volume" quantity="volume" units={units} value={bucketL} onChange={setBucketL}>
            <FieldIssue check={check} path="measurement.trials.0.volumeL" />
          </NumberField>
          <Stopwatch onLap={(s) => void addSeconds(s)} />
          <NumberField label="Or type the seconds" quantity="time" units={units} value={typedSeconds} onChange={setTypedSeconds}>
            {addProblem && (
              <p role="alert" className="mt-1 font-bold text-clay">
                {addProblem}
              </p>
            )}
          </NumberField>
          <Button
            variant="secondary"
            onClick={() => {
              void addSeconds(typedSeconds);
              setTypedSeconds(undefined);
            }}
          >
            Add typed trial
          </Button>
          <TrialList items={seconds.map((s) => `${s.toFixed(1)} s`)} onRemove={(i) => setSeconds((l) => l.filter((_, j) => j !== i))} issueAt={trialIssue} />
        </>
      )}
      {method === 'v-notch' && (
        <>
          <NumberField
            label="Head over the notch (90°)"
            quantity="length"
            units={units}
            value={typedHead}
            onChange={setTypedHead}
            hint="Read the head at least four head-heights upstream of the notch."
          >
            {addProblem && (
              <p role="alert" className="mt-1 font-bold text-clay">
                {addProblem}
              </p>
            )}
          </NumberField>
          <Button variant="secondary" onClick={() => void addHead(typedHead)}>
            Add head reading
          </Button>
          <TrialList
            items={heads.map((h) => showQuantity(h, 'length', units))}
            onRemove={(i) => setHeads((l) => l.filter((_, j) => j !== i))}
            issueAt={trialIssue}
          />
        </>
      )}
      {method === 'float' && (
        <>
          <NumberField label="Float run length" quantity="length" units={units} value={distanceM} onChange={setDistanceM}>
            <FieldIssue check={check} path="measurement.trials.0.distanceM" />
          </NumberField>
          <NumberField label="Cross-section area (width × mean depth)" quantity="area" units={units} value={areaM2} onChange={setAreaM2}>
            <FieldIssue check={check} path="measurement.areaM2" />
          </NumberField>
          <Stopwatch onLap={(s) => void addSeconds(s)} />
          {addProblem && (
            <p role="alert" className="font-bold text-clay">
              {addProblem}
            </p>
          )}
          <TrialList items={seconds.map((s) => `${s.toFixed(1)} s`)} onRemove={(i) => setSeconds((l) => l.filter((_, j) => j !== i))} issueAt={trialIssue} />
        </>
      )}
      <Card tone="creek" padding="md" aria-live="polite" data-testid="flow-live">
        <p className="font-bold">
          Mean flow: <span className="figure">{stats ? showQuantity(stats.mean, 'flowLps', units) : '—'}</span>
        </p>
        <p className="text-stone">
          Spread (sd): <span className="figure">{stats ? showQuantity(stats.sd, 'flowLps', units) : '—'}</span> · {count} trial{count === 1 ? '' : 's'}
        </p>
      </Card>
      <FieldIssue check={check} path="measurement.trials" />
      {message && (
        <p role="status" className="font-bold">
          {message}
        </p>
      )}
      <PrimaryButton onClick={save}>Save flow measurement</PrimaryButton>
    </div>
  );
}
