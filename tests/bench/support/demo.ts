// The demo accounts and visits the page benches open (seeded by npm run bench's set-up, like npm test).
import * as mariadb from 'mariadb';
import { sessionCookie } from '../../integration/support/fixtures';
import type { Role } from '@/lib/shared/domain';
import { appUrl, floorApp } from './report';

async function query<T>(sql: string, params: unknown[] = []): Promise<T[]> {
  const conn = await mariadb.createConnection({
    host: process.env.DB_HOST, port: Number(process.env.DB_PORT), user: process.env.DB_USER,
    password: process.env.DB_PASSWORD, database: process.env.DB_NAME,
  });
  try {
    return (await conn.query(sql, params)) as T[];
  } finally {
    await conn.end();
  }
}

/** A signed session cookie (name and value) for a demo account, as after signing in. */
export async function demoCookie(email: string): Promise<{ name: string; value: string; header: string }> {
  const [row] = await query<{ id: string; organisation_id: string; role: Role; name: string; session_version: number }>(
    'SELECT id, organisation_id, role, name, session_version FROM users WHERE email = ?', [email]);
  if (!row) throw new Error(`no demo account ${email}: is the demo data seeded?`);
  const header = await sessionCookie({ id: row.id, organisationId: row.organisation_id, role: row.role, email, name: row.name, sessionVersion: Number(row.session_version) });
  const [name = '', value = ''] = header.split(/=(.*)/s);
  return { name, value, header };
}

/** A screened demo visit of the advisor (its sheet has a verdict). */
export async function screenedVisitOf(email: string): Promise<string> {
  const [row] = await query<{ id: string }>(
    `SELECT v.id FROM visits v JOIN users u ON u.id = v.advisor_id
     WHERE u.email = ? AND EXISTS (SELECT 1 FROM screenings s WHERE s.visit_id = v.id) ORDER BY v.planned_on LIMIT 1`, [email]);
  if (!row) throw new Error(`no screened visit of ${email}`);
  return row.id;
}

/** The e-mail of the farmer who owns the visit's farm (the sheet's reader). */
export async function farmerOf(visitId: string): Promise<string> {
  const [row] = await query<{ email: string }>(
    'SELECT u.email FROM visits v JOIN farms f ON f.id = v.farm_id JOIN users u ON u.id = f.owner_id WHERE v.id = ?', [visitId]);
  if (!row) throw new Error(`visit ${visitId} has no farmer`);
  return row.email;
}

/** What the page benches open: the app, the empty floor app, and the demo advisor and farmer. */
export async function pageBenchContext() {
  const floorUrl = floorApp().url;
  const advisor = await demoCookie('tobias@wenlow-water.test');
  const visitId = await screenedVisitOf('tobias@wenlow-water.test');
  // The sheet as its reader sees it: the farmer (with the reply form).
  const farmer = await demoCookie(await farmerOf(visitId));
  return { app: appUrl(), floorUrl, advisor, visitId, farmer };
}
