import 'server-only';
import type { Screening as EngineScreening } from '@/lib/engine/screening-types';
import { DemandLine, Farm, Organisation, PipeRun, Point, Screening, User, Visit } from '@/lib/server/db';
import type { SheetSource } from '@/lib/shared/sheet/view-model';
import { SHEET_RELEASED } from '@/lib/shared/visit-states';
import { authorize, type Permission, type SessionUser } from '../auth/permissions';
import { notFound } from '../errors';

type VisitWithFarm = Visit & { Farm?: Farm & { owner?: User | null }; advisor?: User | null };

export interface SheetContext {
  visit: { id: string; organisationId: string; status: Visit['status']; farmId: string };
  advisorId: string | null;
  farmer: { id: string; name: string; email: string; units: 'metric' | 'us' } | null;
  screeningId: string;
  source: SheetSource;
}

/** The visit with its farm, owner and advisor, if the user holds the permission on it (404, then 403; 404 for a farmer before it is sent). */
export async function getSheetVisitOrThrow(user: SessionUser, visitId: string, permission: Permission): Promise<VisitWithFarm> {
  const visit = (await Visit.findOne({
    where: { id: visitId, deletedAt: null },
    include: [
      { model: Farm, include: [{ model: User, as: 'owner', attributes: ['id', 'name', 'email', 'units'] }] },
      { model: User, as: 'advisor', attributes: ['id', 'name'] },
    ],
  })) as VisitWithFarm | null;
  if (!visit) throw notFound('visit');
  authorize(user, permission, {
    organisationId: visit.organisationId,
    advisorIds: visit.advisorId ? [visit.advisorId] : [],
    ownerId: visit.Farm?.ownerId ?? null,
  });
  // The farmer reads the sheet once it has been sent to them, not while the office still checks it.
  if (user.role === 'farmer' && !SHEET_RELEASED.includes(visit.status)) throw notFound('sheet: it has not been sent to you yet');
  return visit;
}

/** Everything a sheet shows for a visit: its latest stored screening and who/where/when (404 before screening). */
export async function loadSheet(user: SessionUser, visitId: string, permission: Permission = 'sheet:read'): Promise<SheetContext> {
  const visit = await getSheetVisitOrThrow(user, visitId, permission);
  const screening = await Screening.findOne({ where: { visitId }, order: [['createdAt', 'DESC']] });
  if (!screening) throw notFound('sheet: this visit has not been screened yet');
  const live = { visitId, deletedAt: null };
  const [points, pipes, demand, organisation] = await Promise.all([
    Point.findAll({
      where: { ...live },
      order: [
        ['createdAt', 'ASC'],
        ['id', 'ASC'],
      ],
    }),
    PipeRun.findAll({ where: live }),
    DemandLine.findAll({ where: { farmId: visit.farmId, deletedAt: null }, attributes: ['kind'] }),
    Organisation.findByPk(visit.organisationId, { attributes: ['settings'] }),
  ]);
  const inputs = screening.inputs as { demand?: { kind: string }[] } | null;
  const owner = visit.Farm?.owner ?? null;
  const pipeLength = (purpose: string) => pipes.find((p) => p.purpose === purpose)?.lengthM ?? null;
  return {
    visit: { id: visit.id, organisationId: visit.organisationId, status: visit.status, farmId: visit.farmId },
    advisorId: visit.advisorId,
    farmer: owner ? { id: owner.id, name: owner.name, email: owner.email, units: owner.units ?? 'metric' } : null,
    screeningId: screening.id,
    source: {
      visitId: visit.id,
      farm: { name: visit.Farm?.name ?? '', area: visit.Farm?.area ?? '', ownerName: owner?.name ?? null },
      advisorName: visit.advisor?.name ?? null,
      visitedAt: visit.visitedAt?.toISOString() ?? null,
      screenedAt: screening.createdAt.toISOString(),
      screening: screening.result as EngineScreening,
      points: points.filter((p) => ['intake', 'pump', 'tank'].includes(p.role)).map((p) => ({ role: p.role, label: p.label, lat: p.lat, lon: p.lon })),
      pipeLengthsM: { drive: pipeLength('drive'), delivery: pipeLength('delivery') },
      // The screened demand is what the figures rest on; the farm's lines now may have moved on.
      demandKinds: inputs?.demand?.map((d) => d.kind) ?? demand.map((d) => d.kind),
      prices: { list: organisation?.settings.priceList ?? {}, pipes: organisation?.settings.pipePrices ?? [] },
    },
  };
}
