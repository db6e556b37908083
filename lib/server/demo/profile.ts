import 'server-only';
import type { Transaction } from 'sequelize';
import { Point } from '@/lib/server/db';
import { demoId } from './ids';

// An invented levelled profile of the Brandt spring brook: 30 stations 10 m apart, a gentle bed with a
// slate step (4 m over 30 m) and a smaller one lower down; the gravel bar below the step floods.
const VISIT = 'visit:brandt-hollow';

function levelAt(c: number): number {
  const step = (from: number, to: number, drop: number) => (c <= from ? 0 : c >= to ? drop : ((c - from) / (to - from)) * drop);
  return Math.round((238.5 - 0.02 * c - step(100, 130, 4) - step(200, 215, 2)) * 1000) / 1000;
}

// The reach on the map: it runs south past the meadow bench, meandering a little; the phone had no fix
// under the alders at 110 m, 120 m and 200 m (those stations are placed by chainage on the map).
const START = { lat: 52.41975, lon: -3.6156 };
const NO_FIX = new Set([11, 12, 20]);

/** Positions of the 30 stations, 10 m apart along a bank bearing 175° ± 20°. */
function stationPositions(): { lat: number; lon: number }[] {
  const out = [START];
  let { lat, lon } = START;
  for (let i = 1; i < 30; i++) {
    const bearing = ((175 + 20 * Math.sin((i * 10) / 50)) * Math.PI) / 180;
    lat += (10 * Math.cos(bearing)) / 111_200;
    lon += (10 * Math.sin(bearing)) / (111_320 * Math.cos((lat * Math.PI) / 180));
    out.push({ lat, lon });
  }
  return out.map((p) => ({ lat: Math.round(p.lat * 1e6) / 1e6, lon: Math.round(p.lon * 1e6) / 1e6 }));
}

/** Adds the demo reach's stations and places the tank on the profile (same datum). */
export async function seedDemoProfile(advisorId: string, takenAt: Date, transaction: Transaction): Promise<void> {
  const visitId = demoId(VISIT);
  const positions = stationPositions();
  for (let i = 0; i < 30; i++) {
    const c = i * 10;
    const floods = c >= 135 && c <= 155;
    const fix = NO_FIX.has(i) ? null : positions[i];
    await Point.create(
      {
        id: demoId(`${VISIT}:station:${i}`),
        visitId,
        role: 'station',
        label: floods ? 'gravel bar' : '',
        lat: fix?.lat ?? null,
        lon: fix?.lon ?? null,
        accuracyM: fix ? 3 + (i % 4) : null,
        altitudeM: null,
        altitudeAccuracyM: null,
        chainageM: c,
        reducedLevelM: levelAt(c),
        flags: floods ? ['no-pump-site'] : [],
        capturedAt: takenAt,
        createdById: advisorId,
      },
      { transaction },
    );
  }
  const tank = await Point.findByPk(demoId(`${VISIT}:point:2`), { transaction, rejectOnEmpty: true });
  await tank.update({ chainageM: 150, reducedLevelM: 261 }, { transaction });
}
