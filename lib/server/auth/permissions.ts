import 'server-only';
import type { Role, SessionUser } from '@/lib/shared/domain';
import { forbidden, notFound } from '../errors';

/**
 * How far a role's permission reaches:
 * - organisation: anything in the caller's organisation;
 * - assigned: records of visits assigned to the caller (advisors);
 * - owner: records of farms the caller owns (farmers);
 * - self: only the caller's own account.
 */
export type Scope = 'organisation' | 'assigned' | 'owner' | 'self';

/** The permission table: every route and action names one of these; a role not listed is refused. */
export const ROLE_PERMISSIONS = {
  'profile:read': { coordinator: 'self', advisor: 'self', farmer: 'self' },
  'visit:read': { coordinator: 'organisation', advisor: 'assigned', farmer: 'owner' },
  'visit:capture': { coordinator: 'organisation', advisor: 'assigned' },
  'visit:plan': { coordinator: 'organisation' },
  // A move outside the table of visit states, with a stated reason (audited).
  'visit:jump': { coordinator: 'organisation' },
  // Photo originals keep their EXIF GPS: staff only; farmers see the thumbnail (no metadata).
  'photo:original': { coordinator: 'organisation', advisor: 'assigned' },
  'visit:export': { coordinator: 'organisation' },
  'visit:audit': { coordinator: 'organisation' },
  'farm:read': { coordinator: 'organisation', advisor: 'assigned', farmer: 'owner' },
  'farm:edit': { coordinator: 'organisation' },
  'demand:edit': { coordinator: 'organisation', advisor: 'assigned', farmer: 'owner' },
  'sheet:read': { coordinator: 'organisation', advisor: 'assigned', farmer: 'owner' },
  'sheet:send': { coordinator: 'organisation', advisor: 'assigned' },
  // The farmer's own word on a sent sheet: read it, go ahead / not now, ask a question.
  'sheet:acknowledge': { farmer: 'owner' },
  'sheet:decide': { farmer: 'owner' },
  // Answering the farmer's questions on the sheet, and the list of questions still open.
  'sheet:answer': { coordinator: 'organisation', advisor: 'assigned' },
  'people:read': { coordinator: 'organisation' },
  'people:manage': { coordinator: 'organisation' },
  'organisation:settings': { coordinator: 'organisation' },
  'sync:use': { coordinator: 'self', advisor: 'self' },
  // Commissioning: the assigned advisor records what the installed ram does; the office reads them all.
  'visit:commission': { coordinator: 'organisation', advisor: 'assigned' },
  'commissioning:read': { coordinator: 'organisation' },
} as const satisfies Record<string, Partial<Record<Role, Scope>>>;

export type Permission = keyof typeof ROLE_PERMISSIONS;

/**
 * What each sync op needs, from the same table: the permission of the route that makes that change
 * through the UI. A visit's own record is captured by its advisor, but deleting it is planning.
 */
export const SYNC_OP_PERMISSIONS: Record<'visit' | 'demandLine' | 'reading', Record<'put' | 'delete', Permission>> = {
  visit: { put: 'visit:capture', delete: 'visit:plan' },
  demandLine: { put: 'demand:edit', delete: 'demand:edit' },
  reading: { put: 'visit:capture', delete: 'visit:capture' },
};

export type { SessionUser };

/** What a record says about who may touch it; the data layer fills in what it knows. */
export interface ResourceOwnership {
  organisationId: string;
  advisorIds?: readonly string[];
  ownerId?: string | null;
  userId?: string;
}

export function scopeOf(role: Role, permission: Permission): Scope | undefined {
  const row: Partial<Record<Role, Scope>> = ROLE_PERMISSIONS[permission];
  return row[role];
}

/** Whether the user may use the permission, on the resource if one is given. Never throws. */
export function can(user: SessionUser, permission: Permission, resource?: ResourceOwnership): boolean {
  const scope = scopeOf(user.role, permission);
  if (!scope) return false;
  if (!resource) return true;
  if (scope === 'self') return resource.userId === undefined || resource.userId === user.id;
  if (resource.organisationId !== user.organisationId) return false;
  if (scope === 'organisation') return true;
  if (scope === 'assigned') return resource.advisorIds?.includes(user.id) ?? false;
  return resource.ownerId === user.id;
}

/**
 * Throws unless `can` allows it: a 403 when the role lacks the permission, a 404 when it has it but
 * the record is out of the caller's reach (another organisation's, another advisor's), so a refusal
 * never tells whether the record exists.
 */
export function authorize(user: SessionUser, permission: Permission, resource?: ResourceOwnership): void {
  if (can(user, permission, resource)) return;
  throw resource && scopeOf(user.role, permission) ? notFound() : forbidden();
}
