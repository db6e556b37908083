import 'server-only';
import { Op } from 'sequelize';
import { DemandLine, Farm, User, Visit } from '@/lib/server/db';
import type { VisitStatus } from '@/lib/shared/domain';
import type { SessionUser } from '../auth/permissions';

export interface FarmSummary {
  id: string;
  name: string;
  area: string;
  owner: { id: string; name: string } | null;
  lat: number | null;
  lon: number | null;
  demandLpd: number;
  /** The state of the farm's latest visit, or null when it never had one. */
  stage: VisitStatus | null;
}

export const FARM_SORTS = ['name', 'area', 'added'] as const;
export interface FarmListFilter {
  q?: string;
  sort?: (typeof FARM_SORTS)[number];
}

const like = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** Farms the user may see (the organisation's, those with a visit assigned to them, or their own), searched and sorted, with each one's stage. */
export async function listFarms(user: SessionUser, page: { page: number; pageSize: number }, filter: FarmListFilter = {}) {
  const where: Record<string, unknown> = { organisationId: user.organisationId, deletedAt: null };
  if (user.role === 'farmer') where.ownerId = user.id;
  if (user.role === 'advisor') {
    const assigned = await Visit.findAll({
      attributes: ['farmId'],
      where: { advisorId: user.id, organisationId: user.organisationId, deletedAt: null },
      group: ['farmId'],
      raw: true,
    });
    where.id = { [Op.in]: assigned.map((v) => v.farmId) };
  }
  const q = filter.q?.trim();
  if (q) {
    // Name, area or the farmer's name.
    const owners = await User.findAll({
      where: { organisationId: user.organisationId, role: 'farmer', name: { [Op.like]: like(q) } },
      attributes: ['id'],
      raw: true,
    });
    Object.assign(where, {
      [Op.or]: [{ name: { [Op.like]: like(q) } }, { area: { [Op.like]: like(q) } }, ...(owners.length ? [{ ownerId: owners.map((o) => o.id) }] : [])],
    });
  }
  const order: [string, string][] =
    filter.sort === 'area'
      ? [
          ['area', 'ASC'],
          ['name', 'ASC'],
        ]
      : filter.sort === 'added'
        ? [['createdAt', 'DESC']]
        : [['name', 'ASC']];
  const { rows, count } = await Farm.findAndCountAll({
    where,
    include: [
      { model: User, as: 'owner', attributes: ['id', 'name'] },
      { model: DemandLine, attributes: ['count', 'litresPerHeadPerDay'], where: { deletedAt: null }, required: false },
    ],
    order: [...order, ['id', 'ASC']],
    limit: page.pageSize,
    offset: (page.page - 1) * page.pageSize,
    distinct: true,
  });
  const latest = new Map<string, VisitStatus>();
  if (rows.length) {
    const visits = await Visit.findAll({
      where: { farmId: rows.map((f) => f.id), deletedAt: null },
      attributes: ['farmId', 'status'],
      order: [
        ['createdAt', 'DESC'],
        ['id', 'ASC'],
      ],
      raw: true,
    });
    for (const v of visits) if (!latest.has(v.farmId)) latest.set(v.farmId, v.status);
  }
  const items: FarmSummary[] = rows.map((farm) => {
    const owner = (farm as Farm & { owner?: User | null }).owner;
    const lines = (farm as Farm & { DemandLines?: DemandLine[] }).DemandLines ?? [];
    return {
      id: farm.id,
      name: farm.name,
      area: farm.area,
      owner: owner ? { id: owner.id, name: owner.name } : null,
      lat: farm.lat,
      lon: farm.lon,
      demandLpd: lines.reduce((sum, l) => sum + l.count * l.litresPerHeadPerDay, 0),
      stage: latest.get(farm.id) ?? null,
    };
  });
  return { items, page: page.page, pageSize: page.pageSize, total: count };
}
