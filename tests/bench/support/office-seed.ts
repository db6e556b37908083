// The office benches' district: 20,000 visits on 2,000 farms in one organisation, straight into MariaDB.
import { randomUUID } from 'node:crypto';
import type * as mariadb from 'mariadb';
import type { makeOrganisation } from '../../integration/support/fixtures';
import { VISIT_STATUSES } from '@/lib/shared/domain';

export const VISITS = 20_000;
export const FARMS = 2_000;
export const EXPORT_ROWS = 5_000;
const AREAS = ['Upper Wenn', 'Lower Wenn', 'Carrow', 'Hob Vale', 'Skelling', 'Marrow Fen', 'Tarn End', 'Colby'];

/** Farms and visits in bulk; the export's advisor gets exactly EXPORT_ROWS visits. */
export async function seedOffice(conn: mariadb.Connection, org: Awaited<ReturnType<typeof makeOrganisation>>) {
  const now = new Date();
  const farmIds = Array.from({ length: FARMS }, () => randomUUID());
  await conn.beginTransaction();
  await conn.query('UPDATE rev_counter SET value = LAST_INSERT_ID(value + ?) WHERE id = 1', [FARMS + VISITS]);
  let rev = Number(((await conn.query('SELECT LAST_INSERT_ID() AS top')) as { top: bigint }[])[0]?.top) - FARMS - VISITS;
  await conn.batch('INSERT INTO farms (id, organisation_id, owner_id, name, area, notes, rev, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?)',
    farmIds.map((id, i) => [id, org.organisationId, i % 2 ? org.farmer.id : org.otherFarmer.id, `Holding ${String(i).padStart(4, '0')}`,
      AREAS[i % AREAS.length], '', ++rev, now, now]));
  const rows = [];
  for (let i = 0; i < VISITS; i++) {
    // The fixture already gave the advisor one visit: 4,999 more make the export's 5,000.
    const advisor = i % 4 === 0 && i > 0 ? org.advisor.id : i % 4 === 1 ? org.otherAdvisor.id : null;
    const day = new Date(Date.UTC(2025, 0, 1) + (i % 900) * 86_400_000).toISOString().slice(0, 10);
    const r = ++rev;
    rows.push([randomUUID(), org.organisationId, farmIds[i % FARMS], advisor, day, VISIT_STATUSES[i % VISIT_STATUSES.length], '', r, r, now, now]);
  }
  for (let i = 0; i < rows.length; i += 2000) {
    await conn.batch('INSERT INTO visits (id, organisation_id, farm_id, advisor_id, planned_on, status, notes, rev, exposed_rev, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)',
      rows.slice(i, i + 2000));
  }
  await conn.commit();
  await conn.query('ANALYZE TABLE visits, farms, users, screenings');
}

