import 'server-only';
import { Op } from 'sequelize';
import { DemandLine, Farm, User, Visit } from '@/lib/server/db';
import type { SessionUser } from '../auth/permissions';

export interface FarmSummary {
  id: string;
  name: string;
  area: string;
  owner: { id: string; name: string } | null;
  lat: number | null;
  lon: number | null;
  demandLpd: number;
}

/** Farms the user may see: the organisation's, those with a visit assigned to them, or their own. */
export async function listFarms(user: SessionUser, page: { page: number; pageSize: number }) {
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
  const { rows, count } = await Farm.findAndCountAll({
    where,
    include: [
      { model: User, as: 'owner', attributes: ['id', 'name'] },
      { model: DemandLine, attributes: ['count', 'litresPerHeadPerDay'], where: { deletedAt: null }, required: false },
    ],
    order: [['name', 'ASC'], ['id', 'ASC']],
    limit: page.pageSize,
    offset: (page.page - 1) * page.pageSize,
    distinct: true,
  });
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
    };
  });
  return { items, page: page.page, pageSize: page.pageSize, total: count };
}
