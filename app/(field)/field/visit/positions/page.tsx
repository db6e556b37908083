'use client';

import { useFieldQuery } from '../../_components/use-field-query';
import { Suspense, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { VerdictMark } from '@/components/verdict-mark';
import { bestPositions, EngineInputError, type BestPositionsResult, type ProfileTank } from '@/lib/engine';
import { fieldDb } from '@/lib/client/db';
import { newId } from '@/lib/client/ids';
import { saveRecord } from '@/lib/client/outbox';
import { adoptPair, levelOf, localProfile } from '@/lib/client/profile-positions';
import { announceSave } from '@/lib/client/sync/triggers';
import { formatCount, formatPercent } from '@/lib/shared/display/numbers';
import { showQuantity } from '@/lib/shared/display/quantities';
import { PrimaryButton, SectionHeader } from '../../_components/choice';
import { NumberField } from '../../_components/number-field';
import { useVisitId } from '../../_components/use-field-data';
import { WithUnits } from '../../_components/with-units';
import type { UnitSystem } from '@/lib/shared/domain';
import { useUndoableDelete } from '../../_components/undo-delete';
import { PositionsChart } from './_components/positions-chart';
import { PositionsMapPanel } from './_components/positions-map-panel';
import { StationForm } from './_components/station-form';

function PositionsPage({ units }: { units: UnitSystem }) {
  const visitId = useVisitId();
  const profile = useFieldQuery(() => localProfile(visitId), [visitId]);
  const [offsetM, setOffsetM] = useState<number | undefined>(0);
  const [tankLevel, setTankLevel] = useState<number | undefined>();
  const [tankChainage, setTankChainage] = useState<number | undefined>();
  const [result, setResult] = useState<BestPositionsResult | null>(null);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  if (!profile) return <p className="text-lg">Reading the phone…</p>;

  const tp = profile.tankPoint;
  const levelM = tankLevel ?? (tp ? levelOf(tp) : null) ?? undefined;
  const chainM = tankChainage ?? tp?.chainageM ?? undefined;
  const tank: ProfileTank | null = levelM !== undefined && chainM !== undefined ? { levelM, chainageM: chainM, offsetM: offsetM ?? 0 } : null;

  async function saveTank() {
    if (levelM === undefined || chainM === undefined) return setMessage('The tank needs its level and where it stands along the bank.');
    const fields = { reducedLevelM: levelM, chainageM: chainM };
    if (tp) await saveRecord('point', tp.id, fields);
    else
      await saveRecord('point', newId(), {
        visitId,
        role: 'tank',
        label: 'Tank',
        lat: null,
        lon: null,
        accuracyM: null,
        altitudeM: null,
        altitudeAccuracyM: null,
        capturedAt: new Date().toISOString(),
        flags: null,
        ...fields,
      });
    announceSave();
    setMessage('Tank saved on this phone.');
  }

  function search() {
    if (!profile?.base || !tank) return setMessage('The search needs a flow measurement, the water needed and the tank.');
    const base = profile.base;
    setBusy(true);
    setMessage(null);
    // Let the "Searching…" state paint before the engine takes the main thread.
    setTimeout(() => {
      try {
        setResult(bestPositions({ ...base, stations: profile.stations.map(({ point: _p, ...s }) => s), tank }));
      } catch (error) {
        setMessage(error instanceof EngineInputError ? error.message : 'The search could not run on these readings.');
      } finally {
        setBusy(false);
      }
    }, 20);
  }

  async function adopt(rank: number) {
    const pair = result?.ranked.find((p) => p.rank === rank);
    if (!pair || !tank || !profile) return;
    if (
      !window.confirm(
        'Adopt this pair? The intake and ram points move to it, the pipe lengths follow, and the fall and lift readings are replaced by the profile\u2019s.',
      )
    )
      return;
    await adoptPair(visitId, pair, profile.stations, tank, units);
    announceSave();
    setMessage(`Pair ${rank} adopted on this phone; it syncs with the next connection and the screen uses it.`);
  }

  return (
    <div className="space-y-5">
      <SectionHeader visitId={visitId} title="Creek profile and best positions" />
      <StationForm visitId={visitId} units={units} />
      <Card as="fieldset" tone="field" padding="md" className="space-y-3">
        <legend className="px-1 text-xl font-bold">Tank</legend>
        <div className="grid gap-3 sm:grid-cols-3">
          <NumberField label="Tank water level" quantity="length" units={units} signed value={levelM} onChange={setTankLevel} />
          <NumberField label="Along the bank at" quantity="length" units={units} value={chainM} onChange={setTankChainage} />
          <NumberField label="Distance away from the creek" quantity="length" units={units} value={offsetM} onChange={setOffsetM} />
        </div>
        <Button variant="secondary" size="wide" onClick={saveTank}>
          Save tank
        </Button>
      </Card>
      <PositionsChart stations={profile.stations} tank={tank} pairs={result?.ranked ?? []} units={units} />
      <PositionsMapPanel stations={profile.stations} tankPoint={tp} pairs={result?.ranked ?? []} />
      <p className="text-stone">
        <span className="figure">{formatCount(profile.stations.length, 'station')}</span>
        {profile.incomplete > 0 ? `, ${formatCount(profile.incomplete, 'station')} without distance or level (left out)` : ''}.
      </p>
      <PrimaryButton
        onClick={search}
        disabled={busy || profile.stations.length < 2}
        why={busy ? undefined : `Book at least two stations with their distance along the bank and level first (${profile.stations.length} so far).`}
      >
        {busy ? 'Searching…' : 'Find the best positions'}
      </PrimaryButton>
      {message && (
        <p role="status" className="font-bold">
          {message}
        </p>
      )}
      {result && (
        <section aria-labelledby="best" className="space-y-3">
          <h2 id="best" className="text-xl font-bold">
            Best pairs
          </h2>
          <p className="text-stone">
            {result.pairsConsidered} pairs looked at, {result.pairsFeasible} within the drive pipe rules.
          </p>
          {result.ranked.length === 0 && <p className="font-bold">No pair fits the rules on this reach.</p>}
          <ol className="space-y-3">
            {result.ranked.map((p) => (
              <Card as="li" tone="field" padding="md" key={`${p.intake.id}-${p.pump.id}`} data-testid={`pair-${p.rank}`}>
                <p className="text-lg font-bold">
                  {p.rank}. Intake at <span className="figure">{showQuantity(p.intake.chainageM, 'length', units)}</span>, ram at{' '}
                  <span className="figure">{showQuantity(p.pump.chainageM, 'length', units)}</span>
                </p>
                <p>
                  Fall <span className="figure">{showQuantity(p.fallM, 'length', units)}</span> · lift{' '}
                  <span className="figure">{showQuantity(p.staticLiftM, 'length', units)}</span> · drive pipe{' '}
                  <span className="figure">{showQuantity(p.driveLengthM, 'length', units)}</span>
                </p>
                {p.standPipe && (
                  <p data-testid={`pair-${p.rank}-stand-pipe`}>
                    Feed pipe <span className="figure">{showQuantity(p.feedLengthM, 'length', units)}</span> to an open stand pipe at{' '}
                    <span className="figure">{showQuantity(p.standPipe.chainageM, 'length', units)}</span>, where the drive pipe starts
                  </p>
                )}
                <p>
                  Delivers about <span className="figure">{showQuantity(p.deliveryLpd, 'litresPerDay', units)}</span>; meets the need in{' '}
                  <span className="figure">{formatPercent(p.probabilityMeetsDemand)}</span> of draws
                </p>
                <p>
                  Screen: <VerdictMark verdict={p.screening.verdict} />
                </p>
                <Button variant="secondary" size="wide" className="mt-2" onClick={() => adopt(p.rank)}>
                  Adopt pair {p.rank}
                </Button>
              </Card>
            ))}
          </ol>
          {result.rejected.length > 0 && (
            <details>
              <summary className="min-h-12 cursor-pointer font-bold">Why other pairs were set aside</summary>
              <ul className="ml-5 list-disc">
                {result.rejected.map((r) => (
                  <li key={r.code}>
                    <span className="figure">{r.count}</span> × {r.text}
                  </li>
                ))}
              </ul>
            </details>
          )}
          <p className="text-sm text-stone">
            A screen, not an engineering design: check the ground, flooding and permits on site, and follow local codes and licensed practice.
          </p>
        </section>
      )}
      <StationList visitId={visitId} units={units} />
    </div>
  );
}

function StationList({ visitId, units }: { visitId: string; units: UnitSystem }) {
  const rows = useFieldQuery(
    async () =>
      (await fieldDb().points.where('visitId').equals(visitId).toArray())
        .filter((p) => !p.deletedAt && p.role === 'station')
        .sort((a, b) => (a.chainageM ?? 0) - (b.chainageM ?? 0)),
    [visitId],
  );
  const { remove, bar } = useUndoableDelete();
  if (!rows?.length) return bar;
  return (
    <details>
      <summary className="min-h-12 cursor-pointer font-bold">Saved stations ({rows.length})</summary>
      <Card as="ul" padding="none" className="divide-y divide-rule">
        {rows.map((p) => (
          <li key={p.id} className="flex items-center justify-between px-3 py-2">
            <span className="figure">
              {showQuantity(p.chainageM, 'length', units)} · level {showQuantity(levelOf(p), 'length', units)}
              {p.flags?.includes('no-pump-site') ? ' · floods' : ''}
              {p.flags?.includes('no-intake') ? ' · no intake' : ''}
            </span>
            <Button variant="quiet" size="sm" onClick={() => remove('point', p.id, 'the station')}>
              Delete
            </Button>
          </li>
        ))}
      </Card>
      {bar}
    </details>
  );
}

export default function Page() {
  return (
    <Suspense>
      <WithUnits title="Creek profile and best positions">{(units) => <PositionsPage units={units} />}</WithUnits>
    </Suspense>
  );
}
