import { z } from 'zod';
import { VISIT_STATUSES } from '../domain';

// Query strings of the list routes. Every list is paginated; page sizes are capped.
export const pageQuery = z.object({
  page: z.coerce.number().int('Page must be a whole number.').min(1, 'Page starts at 1.').max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100, 'At most 100 rows a page.').default(25),
});

export const visitListQuery = pageQuery.extend({
  status: z.enum(VISIT_STATUSES, { message: `Status must be one of: ${VISIT_STATUSES.join(', ')}.` }).optional(),
});
export type VisitListQuery = z.infer<typeof visitListQuery>;

export const idParam = z.object({ id: z.string().uuid('That id is not a valid UUID.') });

/** Reads URLSearchParams into a plain object for zod (last value wins). */
export function searchParamsObject(params: URLSearchParams): Record<string, string> {
  return Object.fromEntries(params.entries());
}
