'use client';

import dynamic from 'next/dynamic';
import { useEffect, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Input } from '@/components/ui/control';
import { Field } from '@/components/ui/field';
import { setDirty } from '@/lib/client/dirty';
import { GOOD_FIX_M, watchFix, type Fix } from '@/lib/client/geolocation';
import { newId } from '@/lib/client/ids';
import { announceSave } from '@/lib/client/sync/triggers';
import type { PointRole, UnitSystem } from '@/lib/shared/domain';
import { showQuantity } from '@/lib/shared/display/quantities';
import { Choice, PrimaryButton } from '../../../_components/choice';
import { NumberField } from '../../../_components/number-field';
import { FieldIssue, useRecordCheck } from '../../../_components/record-check';
import type { MapPoint } from './point-map';

const PointMap = dynamic(() => import('./point-map'), { ssr: false, loading: () => <p className="text-stone">Loading the map…</p> });

const ROLES = [
  { value: 'intake', label: 'Intake' },
  { value: 'pump', label: 'Pump site' },
  { value: 'tank', label: 'Tank' },
  { value: 'station', label: 'Station' },
] as const;

export function PointForm({ visitId, units, points }: { visitId: string; units: UnitSystem; points: MapPoint[] }) {
  const [role, setRole] = useState<(typeof ROLES)[number]['value']>('intake');
  const [label, setLabel] = useState('');
  const [lat, setLat] = useState<number | undefined>();
  const [lon, setLon] = useState<number | undefined>();
  const [altitudeM, setAltitudeM] = useState<number | undefined>();
  const [fix, setFix] = useState<Fix | null>(null);
  const [watching, setWatching] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const { check, save: saveChecked } = useRecordCheck('point', units);

  useEffect(() => {
    if (!watching) return;
    return watchFix(
      (f) => setFix(f),
      (m) => {
        setMessage(m);
        setWatching(false);
      },
    );
  }, [watching]);

  const typed = lat !== undefined || lon !== undefined || label !== '';
  useEffect(() => {
    setDirty('point', typed);
    return () => setDirty('point', false);
  }, [typed]);

  function takeFix(f: Fix) {
    setLat(f.lat);
    setLon(f.lon);
    if (f.altitudeM !== null) setAltitudeM(f.altitudeM);
    setWatching(false);
  }

  async function save() {
    if (lat === undefined || lon === undefined) {
      setMessage('A point needs a latitude and a longitude: use my location, drag the pin, or type them.');
      return;
    }
    setMessage(null);
    const fromFix = fix && fix.lat === lat && fix.lon === lon;
    const saved = await saveChecked(newId(), {
      visitId,
      role: role as PointRole,
      label: label.trim(),
      lat,
      lon,
      accuracyM: fromFix ? fix.accuracyM : null,
      altitudeM: altitudeM ?? null,
      altitudeAccuracyM: fromFix ? fix.altitudeAccuracyM : null,
      chainageM: null,
      capturedAt: new Date().toISOString(),
    });
    if (!saved) {
      setMessage('Not saved yet: see the note at the field above.');
      return;
    }
    setLat(undefined);
    setLon(undefined);
    setAltitudeM(undefined);
    setLabel('');
    setFix(null);
    setMessage('Point saved on this phone.');
    announceSave();
  }

  return (
    <div className="space-y-4">
      <Choice label="This point is the" options={ROLES} value={role} onChange={setRole} />
      <Field id="point-label" label="Name (optional)">
        {(control) => <Input {...control} look="phone" className="mt-1" value={label} onChange={(e) => setLabel(e.target.value)} />}
      </Field>
      <Card tone="field" padding="md" aria-live="polite">
        {!watching && (
          <Button
            variant="secondary"
            size="wide"
            className="min-h-14 text-xl"
            onClick={() => {
              setFix(null);
              setWatching(true);
              setMessage(null);
            }}
          >
            Use my location
          </Button>
        )}
        {watching && (
          <div className="space-y-2">
            <p className="text-lg">
              {fix ? (
                <>
                  Accuracy <span className="figure font-bold">± {showQuantity(fix.accuracyM, 'accuracy', units)}</span>
                  {fix.accuracyM <= GOOD_FIX_M ? ' — good fix' : ' — waiting for a better fix…'}
                </>
              ) : (
                'Waiting for a fix…'
              )}
            </p>
            {fix && <PrimaryButton onClick={() => takeFix(fix)}>Use this fix</PrimaryButton>}
            <Button variant="quiet" size="wide" onClick={() => setWatching(false)}>
              Stop
            </Button>
          </div>
        )}
      </Card>
      <PointMap
        points={points}
        draft={lat !== undefined && lon !== undefined ? { lat, lon } : null}
        onDraftMove={(a, b) => {
          setLat(Number(a.toFixed(6)));
          setLon(Number(b.toFixed(6)));
        }}
      />
      <div className="grid gap-3 sm:grid-cols-2">
        <NumberField label="Latitude" quantity="angle" units="metric" signed value={lat} onChange={setLat}>
          <FieldIssue check={check} path="lat" />
        </NumberField>
        <NumberField label="Longitude" quantity="angle" units="metric" signed value={lon} onChange={setLon}>
          <FieldIssue check={check} path="lon" />
        </NumberField>
        <NumberField label="Altitude (GPS, rough)" quantity="length" units={units} value={altitudeM} onChange={setAltitudeM}>
          <FieldIssue check={check} path="altitudeM" />
        </NumberField>
      </div>
      {message && (
        <p role="status" className="font-bold">
          {message}
        </p>
      )}
      <PrimaryButton onClick={save}>Save point</PrimaryButton>
    </div>
  );
}
