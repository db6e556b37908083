import 'server-only';
import { Op } from 'sequelize';
import { Farm, User, Visit, getSequelize } from '@/lib/server/db';
import type { VisitStatus } from '@/lib/shared/domain';
import { todayIso } from '@/lib/shared/visit-rules';
import { authorize, type SessionUser } from '../auth/permissions';

export interface AdvisorLoad {
  advisor: { id: string; name: string; active: boolean } | null;
  byStatus: Partial<Record<VisitStatus, number>>;
  overdue: number;
}

/** The follow-up board by advisor: visits per state and overdue visits, unassigned last. */
export async function visitCountsByAdvisor(user: SessionUser, today = todayIso()): Promise<AdvisorLoad[]> {
  authorize(user, 'visit:plan');
  const sequelize = getSequelize();
  const where = { organisationId: user.organisationId, deletedAt: null };
  const [rows, late, advisors] = await Promise.all([
    Visit.findAll({
      attributes: ['advisorId', 'status', [sequelize.fn('COUNT', sequelize.col('id')), 'n']],
      where,
      group: ['advisorId', 'status'],
      raw: true,
    }) as unknown as Promise<{ advisorId: string | null; status: VisitStatus; n: number }[]>,
    Visit.findAll({
      attributes: ['advisorId', [sequelize.fn('COUNT', sequelize.col('id')), 'n']],
      where: { ...where, status: { [Op.in]: ['requested', 'scheduled'] }, plannedOn: { [Op.lt]: today } },
      group: ['advisorId'],
      raw: true,
    }) as unknown as Promise<{ advisorId: string | null; n: number }[]>,
    User.findAll({ where: { organisationId: user.organisationId, role: 'advisor' }, attributes: ['id', 'name', 'active'], order: [['name', 'ASC']] }),
  ]);
  const loads = new Map<string | null, AdvisorLoad>();
  for (const a of advisors) loads.set(a.id, { advisor: { id: a.id, name: a.name, active: a.active }, byStatus: {}, overdue: 0 });
  const loadOf = (id: string | null) => {
    let load = loads.get(id);
    if (!load) loads.set(id, (load = { advisor: null, byStatus: {}, overdue: 0 }));
    return load;
  };
  for (const r of rows) loadOf(r.advisorId).byStatus[r.status] = Number(r.n);
  for (const r of late) loadOf(r.advisorId).overdue = Number(r.n);
  return [...loads.values()].sort((a, b) => (a.advisor ? 0 : 1) - (b.advisor ? 0 : 1));
}

/** The farm areas in use in the organisation, for the area filter (index farms_org_area_name). */
export async function districtAreas(user: SessionUser): Promise<string[]> {
  authorize(user, 'visit:plan');
  const rows = await Farm.findAll({
    attributes: ['area'],
    where: { organisationId: user.organisationId, deletedAt: null, area: { [Op.ne]: '' } },
    group: ['area'],
    order: [['area', 'ASC']],
    raw: true,
  });
  return rows.map((r) => r.area);
}
