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

/** Adds the demo reach's stations and places the tank on the profile (same datum). */
export async function seedDemoProfile(advisorId: string, takenAt: Date, transaction: Transaction): Promise<void> {
  const visitId = demoId(VISIT);
  for (let i = 0; i < 30; i++) {
    const c = i * 10;
    const floods = c >= 135 && c <= 155;
    await Point.create(
      { id: demoId(`${VISIT}:station:${i}`), visitId, role: 'station', label: floods ? 'gravel bar' : '', lat: null, lon: null,
        accuracyM: null, altitudeM: null, altitudeAccuracyM: null, chainageM: c, reducedLevelM: levelAt(c),
        flags: floods ? ['no-pump-site'] : [], capturedAt: takenAt, createdById: advisorId },
      { transaction },
    );
  }
  const tank = await Point.findByPk(demoId(`${VISIT}:point:2`), { transaction, rejectOnEmpty: true });
  await tank.update({ chainageM: 150, reducedLevelM: 261 }, { transaction });
}
