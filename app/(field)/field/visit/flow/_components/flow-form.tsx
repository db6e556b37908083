'use client';

import { useEffect, useState } from 'react';
import { floatFlowLps, summarise, vNotchFlowLps, volumetricFlowLps } from '@/lib/engine/flow';
import { newId } from '@/lib/client/ids';
import { saveRecord } from '@/lib/client/outbox';
import { setDirty } from '@/lib/client/dirty';
import { announceSave } from '@/lib/client/sync/triggers';
import type { UnitSystem } from '@/lib/shared/domain';
import { showQuantity } from '@/lib/shared/display/quantities';
import type { FlowMeasurement } from '@/lib/shared/schemas/site-readings';
import { Choice, PrimaryButton } from '../../../_components/choice';
import { NumberField } from '../../../_components/number-field';
import { Stopwatch } from './stopwatch';
import { TrialList } from './trial-list';

type Method = 'volumetric' | 'v-notch' | 'float';
type Season = 'dry' | 'wet' | 'unknown';

const METHODS = [{ value: 'volumetric', label: 'Bucket' }, { value: 'v-notch', label: 'V-notch weir' }, { value: 'float', label: 'Float' }] as const;
const SEASONS = [{ value: 'dry', label: 'Dry season' }, { value: 'wet', label: 'Wet season' }, { value: 'unknown', label: 'Not sure' }] as const;

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
    if (method === 'float' && distanceM && areaM2 && seconds.length) return { method, season, areaM2, coefficient: 0.85, trials: seconds.map((s) => ({ distanceM, seconds: s })) };
    return null;
  }

  async function save() {
    const m = measurement();
    if (!m) {
      setMessage('Add at least one trial first — tap start when the bucket goes under, stop when it is full.');
      return;
    }
    await saveRecord('flowMeasurement', newId(), { visitId, sourceId, takenAt: new Date().toISOString(), notes: '', measurement: m });
    setSeconds([]);
    setHeads([]);
    setMessage(`Saved ${m.trials.length} trial${m.trials.length === 1 ? '' : 's'} on this phone.`);
    announceSave();
  }

  const addSeconds = (s: number | undefined) => {
    if (s && s > 0) setSeconds((list) => [...list, s]);
    else setMessage('Seconds must be more than 0 — tap stop when the bucket is full.');
  };

  return (
    <div className="space-y-4">
      <Choice label="Method" options={METHODS} value={method} onChange={(m) => { setMethod(m); setSeconds([]); setHeads([]); }} />
      <Choice label="Season of this reading" options={SEASONS} value={season} onChange={setSeason} />
      {method === 'volumetric' && (
        <>
          <NumberField label="Bucket volume" quantity="volume" units={units} value={bucketL} onChange={setBucketL} />
          <Stopwatch onLap={(s) => addSeconds(s)} />
          <NumberField label="Or type the seconds" quantity="time" units={units} value={typedSeconds} onChange={setTypedSeconds} />
          <button type="button" onClick={() => { addSeconds(typedSeconds); setTypedSeconds(undefined); }} className="min-h-12 rounded-md border-2 border-slate px-4 font-bold text-slate">Add typed trial</button>
          <TrialList items={seconds.map((s) => `${s.toFixed(1)} s`)} onRemove={(i) => setSeconds((l) => l.filter((_, j) => j !== i))} />
        </>
      )}
      {method === 'v-notch' && (
        <>
          <NumberField label="Head over the notch (90°)" quantity="length" units={units} value={typedHead} onChange={setTypedHead}
            hint="Read the head at least four head-heights upstream of the notch." />
          <button type="button" onClick={() => { if (typedHead && typedHead > 0) setHeads((l) => [...l, typedHead]); setTypedHead(undefined); }}
            className="min-h-12 rounded-md border-2 border-slate px-4 font-bold text-slate">Add head reading</button>
          <TrialList items={heads.map((h) => showQuantity(h, 'length', units))} onRemove={(i) => setHeads((l) => l.filter((_, j) => j !== i))} />
        </>
      )}
      {method === 'float' && (
        <>
          <NumberField label="Float run length" quantity="length" units={units} value={distanceM} onChange={setDistanceM} />
          <NumberField label="Cross-section area (width × mean depth)" quantity="area" units={units} value={areaM2} onChange={setAreaM2} />
          <Stopwatch onLap={(s) => addSeconds(s)} />
          <TrialList items={seconds.map((s) => `${s.toFixed(1)} s`)} onRemove={(i) => setSeconds((l) => l.filter((_, j) => j !== i))} />
        </>
      )}
      <div className="rounded-md border-2 border-creek bg-white p-3" aria-live="polite" data-testid="flow-live">
        <p className="font-bold">Mean flow: <span className="figure">{stats ? showQuantity(stats.mean, 'flowLps', units) : '—'}</span></p>
        <p className="text-stone">Spread (sd): <span className="figure">{stats ? showQuantity(stats.sd, 'flowLps', units) : '—'}</span> · {count} trial{count === 1 ? '' : 's'}</p>
      </div>
      {message && <p role="status" className="font-bold">{message}</p>}
      <PrimaryButton onClick={save}>Save flow measurement</PrimaryButton>
    </div>
  );
}
