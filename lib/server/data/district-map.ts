import 'server-only';
import { Op, literal } from 'sequelize';
import { Farm, Point, Screening, Visit } from '@/lib/server/db';
import type { PointRole, Verdict, VisitStatus } from '@/lib/shared/domain';
import { authorize, type SessionUser } from '../auth/permissions';

export interface MapSite {
  visitId: string;
  farmId: string;
  farmName: string;
  status: VisitStatus;
  verdict: Verdict | null;
  points: { role: PointRole | 'farm'; lat: number; lon: number }[];
}

/**
 * Every visit's located points (or the farm's position when none were taken), with its verdict.
 * Creek-profile stations are left out: a district view wants the sites, not every survey station.
 */
export async function districtSites(user: SessionUser): Promise<MapSite[]> {
  authorize(user, 'visit:plan');
  const visits = (await Visit.findAll({
    where: { organisationId: user.organisationId, deletedAt: null, status: { [Op.ne]: 'cancelled' } },
    include: [{ model: Farm, attributes: ['name', 'lat', 'lon'] }],
    attributes: ['id', 'farmId', 'status'],
    limit: 5000,
  })) as (Visit & { Farm?: Farm })[];
  const ids = visits.map((v) => v.id);
  const [points, screenings] = await Promise.all([
    Point.findAll({
      where: { visitId: { [Op.in]: ids }, deletedAt: null, role: { [Op.ne]: 'station' }, lat: { [Op.ne]: null }, lon: { [Op.ne]: null } },
      attributes: ['visitId', 'role', 'lat', 'lon'],
    }),
    Screening.findAll({ where: { visitId: { [Op.in]: ids } }, attributes: ['visitId', 'verdict', 'createdAt'], order: [['createdAt', 'ASC']] }),
  ]);
  const verdicts = new Map(screenings.map((s) => [s.visitId, s.verdict]));
  const byVisit = new Map<string, MapSite['points']>();
  for (const p of points) {
    if (p.lat === null || p.lon === null) continue;
    const list = byVisit.get(p.visitId) ?? [];
    list.push({ role: p.role, lat: p.lat, lon: p.lon });
    byVisit.set(p.visitId, list);
  }
  return visits.flatMap((v) => {
    const own = byVisit.get(v.id);
    const points = own?.length ? own : v.Farm?.lat != null && v.Farm?.lon != null ? [{ role: 'farm' as const, lat: v.Farm.lat, lon: v.Farm.lon }] : [];
    return points.length
      ? [{ visitId: v.id, farmId: v.farmId, farmName: v.Farm?.name ?? '', status: v.status, verdict: verdicts.get(v.id) ?? null, points }]
      : [];
  });
}

export interface MapFarm {
  farmId: string;
  farmName: string;
  area: string;
  lat: number;
  lon: number;
}

/** The organisation's located farms with no visit under way or done (none, or only cancelled or deleted ones). */
export async function farmsWithoutVisits(user: SessionUser): Promise<MapFarm[]> {
  authorize(user, 'visit:plan');
  const farms = await Farm.findAll({
    where: {
      organisationId: user.organisationId,
      deletedAt: null,
      lat: { [Op.ne]: null },
      lon: { [Op.ne]: null },
      [Op.and]: [literal(`NOT EXISTS (SELECT 1 FROM visits v WHERE v.farm_id = \`Farm\`.\`id\` AND v.deleted_at IS NULL AND v.status <> 'cancelled')`)],
    },
    attributes: ['id', 'name', 'area', 'lat', 'lon'],
    order: [['name', 'ASC']],
    limit: 5000,
  });
  return farms.flatMap((f) => (f.lat === null || f.lon === null ? [] : [{ farmId: f.id, farmName: f.name, area: f.area, lat: f.lat, lon: f.lon }]));
}
