import 'server-only';
import { Organisation, getSequelize } from '@/lib/server/db';
import { isDemandKind } from '@/lib/shared/demand-kinds';
import type { settingsSchema } from '@/lib/shared/schemas/office';
import type { z } from 'zod';
import { recordAudit } from '../audit';
import { authorize, type SessionUser } from '../auth/permissions';
import { invalid } from '../errors';
import { priceListOf } from '@/lib/shared/costs/price-list';
import { defaultOrganisationSettings } from '../organisation-settings';

/** The organisation's settings, with defaults for anything never set. */
export async function getSettings(user: SessionUser) {
  authorize(user, 'organisation:settings');
  const org = await Organisation.findByPk(user.organisationId, { rejectOnEmpty: true });
  return { ...defaultOrganisationSettings(), ...org.settings, priceList: priceListOf(org.settings.priceList) };
}

/** Replaces the settings (the schema has checked the per-head kinds against the catalogue). Audited with before/after. */
export async function updateSettings(user: SessionUser, input: z.output<typeof settingsSchema>) {
  authorize(user, 'organisation:settings');
  const unknown = Object.keys(input.demandFigures).filter((k) => !isDemandKind(k));
  if (unknown.length) {
    throw invalid(
      `demandFigures: unknown kinds ${unknown.join(', ')}.`,
      Object.fromEntries(unknown.map((k) => [`demandFigures.${k}`, ['Not a demand kind the screen knows.']])),
    );
  }
  return getSequelize().transaction(async (transaction) => {
    const org = await Organisation.findByPk(user.organisationId, { transaction, lock: transaction.LOCK.UPDATE, rejectOnEmpty: true });
    const before = { ...defaultOrganisationSettings(), ...org.settings };
    const after = { ...before, ...input };
    await org.update({ settings: after }, { transaction });
    await recordAudit(
      { organisationId: user.organisationId, actorId: user.id, entity: 'organisation', entityId: org.id, action: 'settings', changes: { before, after } },
      transaction,
    );
    return after;
  });
}
