// Two organisations with screened visits and uploaded photos: the resources the matrix and the
// fuzz point at (own, another advisor's or farmer's in the same organisation, another organisation's).
import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { NextRequest } from 'next/server';
import { PUT as putPhoto } from '@/app/api/photos/[id]/route';
import { Screening, SheetResponse, Visit, getSequelize } from '@/lib/server/db';
import type { Role } from '@/lib/shared/domain';
import { makeOrganisation, params, sessionCookie, type TestUser } from './fixtures';
import type { Resource, Target } from './route-table';
import { sha256 } from './route-table';
import { screenFixtureVisit } from './screened';
import { push, putOp } from './sync';

export type Org = Awaited<ReturnType<typeof makeOrganisation>>;
export type Reach = 'own' | 'other-advisor' | 'other-org';
export const REACHES: readonly Reach[] = ['own', 'other-advisor', 'other-org'];

export interface World {
  org: Org;
  otherOrg: Org;
  photos: Map<string, Resource>;
}

/** A small JPEG, different each call (so every photo has its own sha-256). */
export async function tinyJpeg(seed = Math.floor(Math.random() * 255)): Promise<Buffer> {
  return sharp({ create: { width: 64, height: 48, channels: 3, background: { r: seed, g: 120, b: 90 } } })
    .jpeg()
    .toBuffer();
}

/** Pushes a photo's metadata as `advisor` and uploads its bytes; the photo as a matrix resource. */
export async function uploadedPhoto(advisor: TestUser, visit: Resource): Promise<Resource> {
  const bytes = await tinyJpeg();
  const id = randomUUID();
  const { results } = await push(advisor, {
    ops: [
      putOp('photo', id, {
        visitId: visit.visitId,
        pointId: null,
        caption: 'Matrix photo',
        mime: 'image/jpeg',
        bytes: bytes.length,
        sha256: sha256(bytes),
        width: null,
        height: null,
        lat: null,
        lon: null,
        takenAt: null,
      }),
    ],
  });
  if (results[0]?.status !== 'applied') throw new Error(`photo metadata not applied: ${JSON.stringify(results[0])}`);
  const req = new NextRequest(new URL(`/api/photos/${id}`, 'http://127.0.0.1:3100'), {
    method: 'PUT',
    body: new Uint8Array(bytes),
    headers: { cookie: await sessionCookie(advisor), 'content-type': 'application/octet-stream' },
  });
  const res = await putPhoto(req, params({ id }));
  if (res.status !== 200) throw new Error(`photo upload answered ${res.status}`);
  return { ...visit, id, photoBytes: bytes };
}

const visitResource = (o: Org, which: 'visit' | 'otherVisit'): Resource => {
  const visit = o[which];
  const farm = which === 'visit' ? o.farm : o.otherFarm;
  return { id: visit.id, visitId: visit.id, farmId: farm.id, advisorId: visit.advisorId, ownerId: farm.ownerId };
};

/** Builds the two organisations; screens the visits and uploads photos when the target needs them. */
export async function makeWorld(target: Target, label: string): Promise<World> {
  const org = await makeOrganisation(label);
  const otherOrg = await makeOrganisation(`${label}-x`);
  const photos = new Map<string, Resource>();
  if (target === 'visit' || target === 'photo') {
    for (const o of [org, otherOrg]) {
      await screenFixtureVisit(o.visit.id, o.farm.id, o.advisor.id);
      await screenFixtureVisit(o.otherVisit.id, o.otherFarm.id, o.otherAdvisor.id);
    }
    // Sent, so the farmer may read the sheet (a farmer never sees one the office has not sent).
    await getSequelize().transaction(async (transaction) => {
      for (const v of await Visit.findAll({ where: { id: [org.visit.id, org.otherVisit.id, otherOrg.visit.id, otherOrg.otherVisit.id] }, transaction })) {
        await v.update({ status: 'sent' }, { transaction });
      }
    });
    // A farmer's question on each, for the answers route to answer.
    for (const o of [org, otherOrg]) {
      for (const [visit, owner] of [
        [o.visit, o.farmer],
        [o.otherVisit, o.otherFarmer],
      ] as const) {
        const screening = await Screening.findOne({ where: { visitId: visit.id }, attributes: ['id'], rejectOnEmpty: true });
        await SheetResponse.create({
          id: randomUUID(),
          visitId: visit.id,
          screeningId: screening.id,
          authorId: owner.id,
          kind: 'question',
          text: 'How deep is the intake?',
          replyToId: null,
        });
      }
    }
  }
  if (target === 'photo') {
    photos.set('own', await uploadedPhoto(org.advisor, visitResource(org, 'visit')));
    photos.set('other-advisor', await uploadedPhoto(org.otherAdvisor, visitResource(org, 'otherVisit')));
    photos.set('other-org', await uploadedPhoto(otherOrg.advisor, visitResource(otherOrg, 'visit')));
  }
  return { org, otherOrg, photos };
}

/** The caller of a role in the organisation. */
export const callerOf = (o: Org, role: Role): TestUser => (role === 'coordinator' ? o.coordinator : role === 'advisor' ? o.advisor : o.farmer);

/** The resource a cell points at, or undefined where the reach means nothing for the target. */
export function resourceFor(world: World, target: Target, reach: Reach): Resource | undefined {
  const { org, otherOrg } = world;
  if (target === 'none') return undefined;
  if (target === 'photo') return world.photos.get(reach);
  if (target === 'person') {
    if (reach === 'other-advisor') return undefined;
    const person = reach === 'own' ? org.otherFarmer : otherOrg.otherFarmer;
    return { id: person.id, visitId: '', farmId: '', advisorId: null, ownerId: null };
  }
  const visit = reach === 'own' ? visitResource(org, 'visit') : reach === 'other-advisor' ? visitResource(org, 'otherVisit') : visitResource(otherOrg, 'visit');
  return target === 'farm' ? { ...visit, id: visit.farmId } : visit;
}
