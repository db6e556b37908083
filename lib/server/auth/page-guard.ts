import 'server-only';
import { forbidden, redirect } from 'next/navigation';
import type { Role } from '@/lib/shared/domain';
import { getCurrentUser } from './current-user';
import type { SessionUser } from './permissions';

/** For layouts and pages: signed in (else to /login) with one of the roles (else the 403 page). */
export async function requirePageUser(roles: readonly Role[], returnTo: string): Promise<SessionUser> {
  const user = await getCurrentUser();
  if (!user) redirect(`/login?callbackUrl=${encodeURIComponent(returnTo)}`);
  if (!roles.includes(user.role)) forbidden();
  return user;
}
