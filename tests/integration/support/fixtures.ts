import { randomUUID } from 'node:crypto';
import { encode } from 'next-auth/jwt';
import { NextRequest } from 'next/server';
import { defaultOrganisationSettings } from '@/lib/server/organisation-settings';
import type { Role } from '@/lib/shared/domain';
import { Farm, Organisation, User, Visit, getSequelize } from '@/lib/server/db';

export interface TestUser {
  id: string;
  organisationId: string;
  role: Role;
  sessionVersion: number;
  email: string;
  name: string;
}

async function makeUser(organisationId: string, role: Role, label: string): Promise<TestUser> {
  const id = randomUUID();
  const email = `${label}-${id.slice(0, 8)}@fixtures.test`;
  await User.create({ id, organisationId, email, name: label, role, passwordHash: null, units: 'metric', phone: null, lastSignInAt: null });
  return { id, organisationId, role, sessionVersion: 1, email, name: label };
}

/** One organisation with a coordinator, two advisors, two farmers, their farms and a visit each. */
export async function makeOrganisation(label = 'org') {
  const organisationId = randomUUID();
  await Organisation.create({ id: organisationId, name: `${label} trust`, district: label, settings: defaultOrganisationSettings() });
  const coordinator = await makeUser(organisationId, 'coordinator', `${label}-coordinator`);
  const advisor = await makeUser(organisationId, 'advisor', `${label}-advisor`);
  const otherAdvisor = await makeUser(organisationId, 'advisor', `${label}-advisor-2`);
  const farmer = await makeUser(organisationId, 'farmer', `${label}-farmer`);
  const otherFarmer = await makeUser(organisationId, 'farmer', `${label}-farmer-2`);
  // Synced records take a revision, which needs a transaction.
  const { farm, otherFarm, visit, otherVisit } = await getSequelize().transaction(async (transaction) => {
    const farm = await Farm.create(
      { id: randomUUID(), organisationId, ownerId: farmer.id, name: `${label} farm`, area: 'test', lat: null, lon: null, notes: '' },
      { transaction },
    );
    const otherFarm = await Farm.create(
      { id: randomUUID(), organisationId, ownerId: otherFarmer.id, name: `${label} farm 2`, area: 'test', lat: null, lon: null, notes: '' },
      { transaction },
    );
    const visit = await Visit.create(
      {
        id: randomUUID(),
        organisationId,
        farmId: farm.id,
        advisorId: advisor.id,
        plannedOn: '2026-12-10',
        status: 'scheduled',
        notes: '',
        visitedAt: null,
        lastSyncedAt: null,
      },
      { transaction },
    );
    const otherVisit = await Visit.create(
      {
        id: randomUUID(),
        organisationId,
        farmId: otherFarm.id,
        advisorId: otherAdvisor.id,
        plannedOn: '2026-12-11',
        status: 'scheduled',
        notes: '',
        visitedAt: null,
        lastSyncedAt: null,
      },
      { transaction },
    );
    return { farm, otherFarm, visit, otherVisit };
  });
  return { organisationId, coordinator, advisor, otherAdvisor, farmer, otherFarmer, farm, otherFarm, visit, otherVisit };
}

/** A signed next-auth session cookie for the user, as the browser would send it. */
export async function sessionCookie(user: TestUser): Promise<string> {
  const token = await encode({
    secret: process.env.NEXTAUTH_SECRET ?? '',
    token: { uid: user.id, role: user.role, organisationId: user.organisationId, sessionVersion: user.sessionVersion, email: user.email, name: user.name },
  });
  return `next-auth.session-token=${token}`;
}

/** A request to a route handler, optionally signed in as the user. */
export async function request(path: string, user?: TestUser, init: { method?: string; body?: unknown; headers?: Record<string, string> } = {}) {
  const headers: Record<string, string> = { ...(init.headers ?? {}) };
  if (user) headers.cookie = await sessionCookie(user);
  if (init.body !== undefined) headers['content-type'] = 'application/json';
  return new NextRequest(new URL(path, 'http://127.0.0.1:3100'), {
    method: init.method ?? 'GET',
    headers,
    body: init.body === undefined ? undefined : JSON.stringify(init.body),
  });
}

export const params = <P>(value: P) => ({ params: Promise.resolve(value) });
