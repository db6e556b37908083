import 'server-only';
import { DEMAND_CATALOGUE, type DemandKind } from '@/lib/engine/demand';
import { DemandLine, Farm, FarmNeed, Visit, getSequelize } from '@/lib/server/db';
import { HOUSEHOLD_KIND, type FarmNeedsBody } from '@/lib/shared/schemas/sheet';
import { ft2ToM2 } from '@/lib/shared/units';
import { authorize, type Permission, type SessionUser } from '../auth/permissions';
import { recordAudit } from '../audit';
import { notFound } from '../errors';

export interface DemandLineView {
  id: string;
  kind: string;
  label: string;
  count: number;
  litresPerHeadPerDay: number;
  figureSource: string;
  rev: number;
}
export interface FarmNeedsView {
  farmId: string;
  farmName: string;
  people: number;
  animals: { kind: string; count: number }[];
  gardenM2: number;
  tankSite: string;
  lines: DemandLineView[];
}

async function farmOrThrow(user: SessionUser, farmId: string, permission: Permission): Promise<Farm> {
  const farm = await Farm.findOne({ where: { id: farmId, deletedAt: null } });
  if (!farm) throw notFound('farm');
  const visits = await Visit.findAll({ where: { farmId, deletedAt: null }, attributes: ['advisorId'] });
  authorize(user, permission, {
    organisationId: farm.organisationId,
    advisorIds: visits.map((v) => v.advisorId).filter((id): id is string => !!id),
    ownerId: farm.ownerId,
  });
  return farm;
}

async function needsView(farm: Farm): Promise<FarmNeedsView> {
  const [lines, need] = await Promise.all([
    DemandLine.findAll({
      where: { farmId: farm.id, deletedAt: null },
      order: [
        ['createdAt', 'ASC'],
        ['id', 'ASC'],
      ],
    }),
    FarmNeed.findByPk(farm.id),
  ]);
  const isPerson = (k: string) => k.startsWith('person');
  return {
    farmId: farm.id,
    farmName: farm.name,
    people: lines.filter((l) => isPerson(l.kind)).reduce((s, l) => s + l.count, 0),
    animals: lines.filter((l) => !isPerson(l.kind) && l.kind !== 'garden-m2').map((l) => ({ kind: l.kind, count: l.count })),
    gardenM2: lines.filter((l) => l.kind === 'garden-m2').reduce((s, l) => s + l.count, 0),
    tankSite: need?.tankSite ?? '',
    lines: lines.map((l) => ({
      id: l.id,
      kind: l.kind,
      label: DEMAND_CATALOGUE[l.kind as DemandKind]?.label ?? l.kind,
      count: l.count,
      litresPerHeadPerDay: l.litresPerHeadPerDay,
      figureSource: l.figureSource,
      rev: Number(l.rev),
    })),
  };
}

/** The farm's water needs and demand lines, for the farmer, the assigned advisor and the coordinator. */
export async function getFarmNeeds(user: SessionUser, farmId: string): Promise<FarmNeedsView> {
  return needsView(await farmOrThrow(user, farmId, 'farm:read'));
}

/**
 * Writes what the farmer needs as the farm's demand lines (one per kind; a line the advisor already
 * has keeps its per-head figure, only the count changes), so the advisor's phone pulls them.
 */
export async function putFarmNeeds(user: SessionUser, farmId: string, body: FarmNeedsBody): Promise<FarmNeedsView> {
  const farm = await farmOrThrow(user, farmId, 'demand:edit');
  const gardenM2 = Math.round(body.gardenUnit === 'ft2' ? ft2ToM2(body.gardenArea) : body.gardenArea);
  await getSequelize().transaction(async (transaction) => {
    const lines = await DemandLine.findAll({
      where: { farmId, deletedAt: null },
      order: [
        ['createdAt', 'ASC'],
        ['id', 'ASC'],
      ],
      transaction,
    });
    const personLine = lines.find((l) => l.kind.startsWith('person'));
    const wanted = new Map<string, number>();
    if (body.people > 0) wanted.set(personLine?.kind ?? HOUSEHOLD_KIND, body.people);
    for (const a of body.animals) if (a.count > 0) wanted.set(a.kind, a.count);
    if (gardenM2 > 0) wanted.set('garden-m2', gardenM2);
    for (const line of lines) {
      const count = wanted.get(line.kind);
      if (count === undefined) await line.update({ deletedAt: new Date() }, { transaction });
      else if (count !== line.count) await line.update({ count }, { transaction });
      wanted.delete(line.kind);
    }
    for (const [kind, count] of wanted) {
      const entry = DEMAND_CATALOGUE[kind as DemandKind];
      await DemandLine.create(
        {
          id: crypto.randomUUID(),
          farmId,
          kind,
          count,
          litresPerHeadPerDay: entry.litresPerHeadPerDay,
          figureSource: entry.sourceId,
          note: "From the farmer's own needs",
          createdById: user.id,
        },
        { transaction },
      );
    }
    const [need] = await FarmNeed.findOrCreate({ where: { farmId }, defaults: { farmId, tankSite: body.tankSite, updatedById: user.id }, transaction });
    await need.update({ tankSite: body.tankSite, updatedById: user.id }, { transaction });
    await recordAudit(
      {
        organisationId: farm.organisationId,
        actorId: user.id,
        entity: 'farm',
        entityId: farmId,
        action: 'needs_entered',
        changes: { people: body.people, animals: body.animals, gardenM2, tankSite: body.tankSite },
      },
      transaction,
    );
  });
  return needsView(farm);
}
