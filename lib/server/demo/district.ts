import 'server-only';
import type { Transaction } from 'sequelize';
import {
  DemandLine,
  FallReading,
  Farm,
  FlowMeasurement,
  PipeRun,
  Point,
  Screening,
  SheetResponse,
  SheetSend,
  User,
  Visit,
  WaterSource,
  batchInsert,
  buildRow,
  reserveRevs,
  writeSyncedRows,
} from '@/lib/server/db';
import { DEMAND_CATALOGUE } from '@/lib/engine/demand';
import { predictionFromFigures } from '@/lib/engine/commissioning';
import type { SessionUser } from '@/lib/shared/domain';
import { commissionVisit } from '../data/commissioning';
import { screenVisit } from '../services/screening';
import { demoId } from './ids';
import { DISTRICT_ADVISORS, DISTRICT_FARMERS, DISTRICT_FARMS, type DistrictFarm, type SiteKind } from './district-scenario';

const DAY = 86_400_000;
const dayOf = (days: number, now: Date) => new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() + days));
const isoDay = (d: Date) => d.toISOString().slice(0, 10);

// A stable number in [0, 1) from a name, so the district looks the same on every machine.
function unit(name: string): number {
  return parseInt(demoId(name).slice(0, 8), 16) / 0x1_0000_0000;
}

// The valley's farms lie within about 5 km of its middle.
const MIDDLE = { lat: 52.418, lon: -3.618 };
function farmPosition(farm: DistrictFarm, i: number) {
  if (farm.strayPosition) return farm.strayPosition;
  const round = (x: number) => Math.round(x * 1e5) / 1e5;
  return { lat: round(MIDDLE.lat + (unit(`lat:${i}`) - 0.5) * 0.075), lon: round(MIDDLE.lon + (unit(`lon:${i}`) - 0.5) * 0.13) };
}

const SITE_WALKED: readonly string[] = ['screened', 'sent', 'acknowledged', 'agreed', 'declined', 'installed', 'commissioned'];
const SHEET_OUT: readonly string[] = ['sent', 'acknowledged', 'agreed', 'declined', 'installed', 'commissioned'];

// Invented readings for each kind of site, stored as the phone sends them: fall in metres levelled in
// set-ups, lift by clinometer legs (or levelled, where the tank sits below the intake), a bucket
// timed three times, and the two pipes.
interface SiteShape {
  fallM: number;
  legs: [number, number][];
  liftLevelM?: number;
  bucketS: number;
  driveM: number;
  deliveryM: number;
}
const SHAPES: Record<SiteKind, SiteShape> = {
  go: {
    fallM: 3.6,
    legs: [
      [60, -10],
      [70, -9],
    ],
    bucketS: 8.5,
    driveM: 22,
    deliveryM: 380,
  },
  conditional: {
    fallM: 2.8,
    legs: [
      [80, -17],
      [70, -15],
    ],
    bucketS: 14,
    driveM: 26,
    deliveryM: 300,
  },
  'no-go': {
    fallM: 1.1,
    legs: [
      [90, -20],
      [90, -19],
      [60, -15],
    ],
    bucketS: 30,
    driveM: 12,
    deliveryM: 520,
  },
  gravity: { fallM: 5.5, legs: [], liftLevelM: 2.2, bucketS: 20, driveM: 30, deliveryM: 140 },
};

function levelRows(totalM: number) {
  const steps = Math.max(1, Math.ceil(totalM / 2.4));
  const rows: Record<string, number>[] = [];
  for (let s = 0; s < steps; s++) {
    const drop = Math.round((totalM / steps) * 1000) / 1000;
    rows.push(s === 0 ? { backsightM: 0.4 } : { foresightM: 0.4 + drop, backsightM: 0.4 });
  }
  rows.push({ foresightM: 0.4 + Math.round((totalM / steps) * 1000) / 1000 });
  return rows;
}

type Rows = { model: Parameters<typeof writeSyncedRows>[0]; values: Record<string, unknown>[] }[];

/**
 * Adds the rest of Wenlow Vale: two advisors, the farmers, 37 farms (two with no visit yet) with their needs and visits in
 * every state, the walked sites' readings (screened by the engine), sends, the farmers' readings,
 * decisions and questions, and two commissioned rams. Rows go in bulk; only the screenings and the
 * commissionings go one by one, through the same code a sync uses.
 */
export async function seedDemoDistrict(orgId: string, passwordHash: string, transaction: Transaction, now = new Date()): Promise<void> {
  const coordinatorId = demoId('user:maren');
  await User.bulkCreate(
    [
      ...DISTRICT_ADVISORS.map((p) => ({
        id: demoId(p.key),
        organisationId: orgId,
        email: p.email,
        name: p.name,
        role: 'advisor' as const,
        passwordHash,
        units: 'metric' as const,
        phone: null,
        lastSignInAt: null,
      })),
      ...DISTRICT_FARMERS.map((p) => ({
        id: demoId(p.key),
        organisationId: orgId,
        email: p.email,
        name: p.name,
        role: 'farmer' as const,
        passwordHash,
        units: 'metric' as const,
        phone: null,
        lastSignInAt: null,
      })),
    ],
    { transaction },
  );

  const rows: Rows = [];
  const add = (model: Rows[number]['model'], values: Record<string, unknown>) => {
    let bucket = rows.find((r) => r.model === model);
    if (!bucket) rows.push((bucket = { model, values: [] }));
    bucket.values.push(values);
  };
  DISTRICT_FARMS.forEach((farm, i) => {
    const key = `district:${i}`;
    const farmId = demoId(`${key}:farm`);
    const owner = DISTRICT_FARMERS[i % DISTRICT_FARMERS.length];
    const ownerId = owner ? demoId(owner.key) : null;
    const at = farmPosition(farm, i);
    add(Farm, { id: farmId, organisationId: orgId, ownerId, name: farm.name, area: farm.area, lat: at.lat, lon: at.lon, notes: '', createdById: ownerId });
    farm.demand.forEach((line, j) => {
      const entry = DEMAND_CATALOGUE[line.kind];
      add(DemandLine, {
        id: demoId(`${key}:demand:${j}`),
        farmId,
        kind: line.kind,
        count: line.count,
        litresPerHeadPerDay: entry.litresPerHeadPerDay,
        figureSource: entry.sourceId,
        note: '',
        createdById: ownerId,
      });
    });
    if (!farm.status) return;
    const visitId = demoId(`${key}:visit`);
    const planned = farm.plannedInDays === null ? null : dayOf(farm.plannedInDays, now);
    const walked = planned && !['requested', 'scheduled', 'cancelled'].includes(farm.status) ? new Date(planned.getTime() + 10 * 3600_000) : null;
    // A ram is commissioned through the commissioning check below: the visit starts installed.
    const status = farm.status === 'commissioned' ? 'installed' : farm.status;
    add(Visit, {
      id: visitId,
      organisationId: orgId,
      farmId,
      advisorId: farm.advisor ? demoId(farm.advisor) : null,
      plannedOn: planned ? isoDay(planned) : null,
      status,
      notes: farm.notes ?? '',
      createdById: coordinatorId,
      visitedAt: walked,
      lastSyncedAt: walked,
    });
    if (!farm.site || !walked || !planned) return;
    const advisorId = farm.advisor ? demoId(farm.advisor) : null;
    const shape = SHAPES[farm.site];
    const base = { visitId, createdById: advisorId };
    const sourceId = demoId(`${key}:source`);
    add(WaterSource, {
      ...base,
      id: sourceId,
      name: `${farm.name} ${farm.site === 'gravity' ? 'spring' : 'brook'}`,
      kind: farm.site === 'gravity' ? 'spring' : 'creek',
      notes: '',
    });
    const wobble = 1 + (unit(`${key}:flow`) - 0.5) * 0.2;
    add(FlowMeasurement, {
      ...base,
      id: demoId(`${key}:flow`),
      sourceId,
      method: 'volumetric',
      season: 'dry',
      takenAt: walked,
      notes: '',
      readings: { trials: [0.98, 1.03, 1].map((f) => ({ volumeL: 20, seconds: Math.round(shape.bucketS * wobble * f * 10) / 10 })) },
    });
    const fallM = Math.round(shape.fallM * (1 + (unit(`${key}:fall`) - 0.5) * 0.15) * 100) / 100;
    add(FallReading, {
      ...base,
      id: demoId(`${key}:fall`),
      purpose: 'fall',
      method: 'level',
      seq: 0,
      takenAt: walked,
      notes: '',
      bookings: { rows: levelRows(fallM) },
    });
    add(FallReading, {
      ...base,
      id: demoId(`${key}:lift`),
      purpose: 'lift',
      seq: 1,
      takenAt: walked,
      notes: '',
      ...(shape.liftLevelM !== undefined
        ? { method: 'level', bookings: { bookedFrom: 'pump', rows: [{ backsightM: 0.4 + shape.liftLevelM }, { foresightM: 0.4 }] } }
        : { method: 'clinometer', bookings: { bookedFrom: 'pump', legs: shape.legs.map(([d, a]) => ({ slopeDistanceM: d, angleBelowHorizontalDeg: a })) } }),
    });
    add(PipeRun, {
      id: demoId(`${key}:drive`),
      visitId,
      purpose: 'drive',
      lengthM: shape.driveM,
      diameterMm: null,
      material: 'galvanized-steel',
      pressureClass: null,
      createdById: advisorId,
    });
    add(PipeRun, {
      id: demoId(`${key}:delivery`),
      visitId,
      purpose: 'delivery',
      lengthM: shape.deliveryM,
      diameterMm: null,
      material: 'hdpe',
      pressureClass: null,
      createdById: advisorId,
    });
    const points = [
      ['intake', 'Intake pool', 0.0011, -0.0016],
      ['pump', 'Ram site', 0.0008, -0.0012],
      ['tank', 'Tank above the yard', -0.0004, 0.0014],
    ] as const;
    points.forEach(([role, label, dLat, dLon], j) =>
      add(Point, {
        ...base,
        id: demoId(`${key}:point:${j}`),
        role,
        label,
        lat: Math.round((at.lat + dLat) * 1e6) / 1e6,
        lon: Math.round((at.lon + dLon) * 1e6) / 1e6,
        accuracyM: 4 + j,
        altitudeM: null,
        altitudeAccuracyM: null,
        chainageM: null,
        capturedAt: walked,
      }),
    );
  });

  // One block of revisions for every synced row, then one multi-row insert per table.
  const total = rows.reduce((n, r) => n + r.values.length, 0);
  const block = await reserveRevs(transaction, total);
  for (const { model, values } of rows) {
    const built = values.map((v) => {
      const rev = block.take();
      return buildRow(model, { ...v, rev, ...(model === Visit ? { exposedRev: rev } : {}) });
    });
    await writeSyncedRows(model, { created: built, updated: [] }, [], transaction);
  }

  await seedDistrictOutcomes(orgId, coordinatorId, transaction, now);
}

// Screens every walked site, then writes what followed: sends, the farmers' answers, commissionings.
async function seedDistrictOutcomes(orgId: string, coordinatorId: string, transaction: Transaction, now: Date): Promise<void> {
  const sends: Record<string, unknown>[] = [];
  const responses: Record<string, unknown>[] = [];
  const commissioned: { visitId: string; advisorId: string; screeningId: string; i: number }[] = [];
  for (const [i, farm] of DISTRICT_FARMS.entries()) {
    if (!farm.site || !farm.status || !SITE_WALKED.includes(farm.status) || farm.plannedInDays === null) continue;
    const key = `district:${i}`;
    const visitId = demoId(`${key}:visit`);
    const advisorId = demoId(farm.advisor ?? 'user:maren');
    const outcome = await screenVisit(visitId, advisorId, transaction);
    if (outcome.status === 'incomplete') throw new Error(`demo readings of ${farm.name} are incomplete: ${outcome.missing.join('; ')}`);
    const screeningId = outcome.screeningId;
    const owner = DISTRICT_FARMERS[i % DISTRICT_FARMERS.length];
    const ownerId = demoId(owner?.key ?? '');
    const sentAt = new Date(dayOf(farm.plannedInDays + 4, now).getTime() + 9 * 3600_000);
    const later = (days: number, hour = 19) => new Date(sentAt.getTime() + days * DAY + (hour - 9) * 3600_000);
    const send = (status: 'sent' | 'failed', at: Date) =>
      sends.push({
        id: demoId(`${key}:send:${status}`),
        visitId,
        screeningId,
        sentById: coordinatorId,
        toAddress: owner?.email ?? '',
        paper: 'a4',
        status,
        error: status === 'failed' ? 'The mail server did not answer.' : null,
        messageId: status === 'sent' ? `<${demoId(`${key}:message`)}@fallbook.test>` : null,
        createdAt: at,
        updatedAt: at,
      });
    const say = (kind: string, text: string, at: Date, authorId = ownerId, replyToId: string | null = null, n = 0) =>
      responses.push({
        id: demoId(`${key}:response:${kind}:${n}`),
        visitId,
        screeningId,
        authorId,
        kind,
        text,
        replyToId,
        createdAt: at,
      });
    if (farm.story === 'send-failed') send('failed', sentAt);
    if (!SHEET_OUT.includes(farm.status)) continue;
    send('sent', sentAt);
    if (farm.status !== 'sent') say('acknowledged', '', later(1));
    if (['agreed', 'installed', 'commissioned'].includes(farm.status)) say('go-ahead', '', later(3));
    if (farm.status === 'declined') say('not-now', farm.declineReason ?? '', later(5));
    if (farm.story === 'question-open') say('question', 'Does the ram need looking after in winter, and who do we call if it stops?', later(2, 8));
    if (farm.story === 'question-answered') {
      const questionId = demoId(`${key}:response:question:0`);
      say('question', 'Could the tank go by the old barn instead? It is a little lower.', later(1, 21));
      say(
        'answer',
        'Yes: the barn is 4 m lower, so the ram lifts a little more water there. I will bring the level on Thursday to check.',
        later(2, 10),
        advisorId,
        questionId,
      );
    }
    if (farm.status === 'commissioned') commissioned.push({ visitId, advisorId, screeningId, i });
  }
  await batchInsert(SheetSend, sends, transaction);
  await batchInsert(SheetResponse, responses, transaction);

  // The two running rams: measured at the commissioning check a few weeks after the build.
  for (const [n, c] of commissioned.entries()) {
    const screening = await Screening.findByPk(c.screeningId, { transaction, rejectOnEmpty: true });
    const predicted = predictionFromFigures((screening.result as { figures: Record<string, { value: number | null }> }).figures);
    if (!predicted) throw new Error(`the demo screening of visit ${c.visitId} has no prediction`);
    const factor = n === 0 ? 0.93 : 1.04;
    const advisor = await User.findByPk(c.advisorId, { transaction, rejectOnEmpty: true });
    const user: SessionUser = { id: advisor.id, organisationId: orgId, role: 'advisor', name: advisor.name, email: advisor.email, units: 'metric' };
    await commissionVisit(
      user,
      c.visitId,
      {
        driveLpm: Math.round(predicted.driveLpm * 0.97 * 10) / 10,
        deliveredLpm: Math.round(((predicted.deliveryLpd * factor) / 1440) * 100) / 100,
        beatsPerMinute: 52 + n * 6,
        liftM: Math.round(predicted.totalLiftM * 10) / 10,
        notes: n === 0 ? 'Running sweetly; waste valve stroke set to 18 mm.' : 'A little more than predicted after the spring rains.',
      },
      transaction,
      demoId(`district:${c.i}:commissioning`),
    );
  }
}
