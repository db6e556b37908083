import 'server-only';
import { User } from '@/lib/server/db';
import { authorize, type SessionUser } from '../auth/permissions';

/** The people of the coordinator's organisation, by role then name. */
export async function listPeople(user: SessionUser, page: { page: number; pageSize: number }) {
  authorize(user, 'people:read');
  const { rows, count } = await User.findAndCountAll({
    where: { organisationId: user.organisationId },
    attributes: ['id', 'name', 'email', 'role', 'active', 'lastSignInAt'],
    order: [
      ['role', 'ASC'],
      ['name', 'ASC'],
    ],
    limit: page.pageSize,
    offset: (page.page - 1) * page.pageSize,
  });
  return {
    items: rows.map((u) => ({
      id: u.id,
      name: u.name,
      email: u.email,
      role: u.role,
      active: u.active,
      lastSignInAt: u.lastSignInAt?.toISOString() ?? null,
    })),
    page: page.page,
    pageSize: page.pageSize,
    total: count,
  };
}
