import 'server-only';
import { DemandLine, Farm, Organisation, User, Visit, getSequelize } from '@/lib/server/db';
import { DEMAND_CATALOGUE } from '@/lib/engine/demand';
import { hashPassword } from '../auth/passwords';
import { defaultOrganisationSettings } from '../organisation-settings';
import { demoId } from './ids';
import { DEMO_FARMS, DEMO_ORGANISATION, DEMO_PASSWORD, DEMO_PEOPLE, DEMO_VISITS } from './scenario';
import { seedDemoReadings } from './readings';
import { seedDemoDistrict } from './district';

function dayOffset(days: number, from = new Date()): string {
  const date = new Date(Date.UTC(from.getUTCFullYear(), from.getUTCMonth(), from.getUTCDate() + days));
  return date.toISOString().slice(0, 10);
}

/**
 * Loads the Wenlow Vale demo. Idempotent: when the demo organisation exists nothing is touched,
 * so a second start neither duplicates nor wipes what people changed.
 */
export async function seedDemo(): Promise<'created' | 'present'> {
  const sequelize = getSequelize();
  const orgId = demoId(DEMO_ORGANISATION.key);
  if (await Organisation.findByPk(orgId)) return 'present';

  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await sequelize.transaction(async (transaction) => {
    await Organisation.create(
      { id: orgId, name: DEMO_ORGANISATION.name, district: DEMO_ORGANISATION.district, settings: defaultOrganisationSettings() },
      { transaction },
    );
    for (const person of DEMO_PEOPLE) {
      await User.create(
        {
          id: demoId(person.key),
          organisationId: orgId,
          email: person.email,
          name: person.name,
          role: person.role,
          passwordHash,
          units: person.key === 'user:ines' ? 'us' : 'metric',
          phone: null,
          lastSignInAt: null,
        },
        { transaction },
      );
    }
    for (const farm of DEMO_FARMS) {
      const farmId = demoId(farm.key);
      await Farm.create(
        {
          id: farmId,
          organisationId: orgId,
          ownerId: demoId(farm.owner),
          name: farm.name,
          area: farm.area,
          lat: farm.lat,
          lon: farm.lon,
          notes: farm.notes,
          createdById: demoId(farm.owner),
        },
        { transaction },
      );
      for (const [i, line] of farm.demand.entries()) {
        const entry = DEMAND_CATALOGUE[line.kind];
        await DemandLine.create(
          {
            id: demoId(`${farm.key}:demand:${i}`),
            farmId,
            kind: line.kind,
            count: line.count,
            litresPerHeadPerDay: entry.litresPerHeadPerDay,
            figureSource: entry.sourceId,
            note: line.note ?? '',
            createdById: demoId(farm.owner),
          },
          { transaction },
        );
      }
    }
    const coordinatorId = demoId('user:maren');
    for (const visit of DEMO_VISITS) {
      await Visit.create(
        {
          id: demoId(visit.key),
          organisationId: orgId,
          farmId: demoId(visit.farm),
          advisorId: visit.advisor ? demoId(visit.advisor) : null,
          plannedOn: visit.plannedInDays === null ? null : dayOffset(visit.plannedInDays),
          status: visit.status,
          notes: visit.notes,
          createdById: coordinatorId,
          visitedAt: ['surveyed', 'screened', 'sent'].includes(visit.status) ? new Date(`${dayOffset(visit.plannedInDays ?? 0)}T10:00:00Z`) : null,
          lastSyncedAt: ['surveyed', 'screened', 'sent'].includes(visit.status) ? new Date() : null,
        },
        { transaction },
      );
    }
    await seedDemoReadings(transaction);
    await seedDemoDistrict(orgId, passwordHash, transaction);
  });
  return 'created';
}
