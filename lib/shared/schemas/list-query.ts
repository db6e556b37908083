import * as z from '@/lib/shared/zod';
import { VERDICTS, VISIT_STATUSES } from '../domain';
import { isoDay as boundedDay } from './bounds';

// Query strings of the list routes. Every list is paginated; page sizes are capped.
export const pageQuery = z.object({
  page: z.coerce.number().int('Page must be a whole number.').min(1, 'Page starts at 1.').max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100, 'At most 100 rows a page.').default(25),
});

const isoDay = boundedDay('Use a date like 2026-05-31.');

export const VISIT_SORTS = ['planned', 'farm', 'advisor', 'status', 'synced', 'updated'] as const;
export type VisitSort = (typeof VISIT_SORTS)[number];

// Empty strings from a form's "any" choice mean "no filter".
const blankToUndefined = (value: unknown) => (value === '' ? undefined : value);
const opt = <T extends z.ZodType>(schema: T) => z.preprocess(blankToUndefined, schema.optional());

/** Filters of the visits list and its CSV export (the same names in the page's URL). */
export const visitFilters = z
  .object({
    status: opt(z.enum(VISIT_STATUSES, { message: `Status must be one of: ${VISIT_STATUSES.join(', ')}.` })),
    advisor: opt(z.union([z.literal('none'), z.string().uuid('Advisor must be an advisor id or "none".')])),
    plannedFrom: opt(isoDay),
    plannedTo: opt(isoDay),
    verdict: opt(z.enum([...VERDICTS, 'none'], { message: `Verdict must be one of: ${VERDICTS.join(', ')}, none.` })),
    area: opt(z.string().trim().max(160, 'Area is at most 160 characters.')),
    q: opt(z.string().trim().max(100, 'Search is at most 100 characters.')),
    overdue: opt(z.enum(['1', 'true']).transform(() => true)),
    sort: z.preprocess(blankToUndefined, z.enum(VISIT_SORTS, { message: `Sort by one of: ${VISIT_SORTS.join(', ')}.` }).default('planned')),
    dir: z.preprocess(blankToUndefined, z.enum(['asc', 'desc'], { message: 'Direction is asc or desc.' }).default('desc')),
  })
  .refine((f) => !f.plannedFrom || !f.plannedTo || f.plannedFrom <= f.plannedTo, {
    message: 'The "from" date must not be after the "to" date.',
    path: ['plannedTo'],
  });
export type VisitFilters = z.infer<typeof visitFilters>;

export const visitListQuery = z.intersection(pageQuery, visitFilters);
export type VisitListQuery = { page: number; pageSize: number } & Partial<VisitFilters>;

export const idParam = z.object({ id: z.string().uuid('That id is not a valid UUID.') });

/** Reads URLSearchParams into a plain object for zod (last value wins). */
export function searchParamsObject(params: URLSearchParams): Record<string, string> {
  return Object.fromEntries(params.entries());
}
