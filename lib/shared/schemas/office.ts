import { DEMAND_CATALOGUE } from '@/lib/engine/demand';
import { priceListSchema } from '@/lib/shared/costs/price-list';
import * as z from '@/lib/shared/zod';
import { ROLES, UNIT_SYSTEMS, VISIT_STATUSES } from '../domain';
import { JUMP_REASON_MIN } from '../visit-states';
import { isPastDay, PAST_DAY_UNCONFIRMED, plannedDayProblem } from '../visit-rules';

// Bodies of the coordinator's office routes; the forms use the same schemas (zodResolver).

// Planned days are held to a sane window below (plannedDayProblem), tighter than the general date bounds.
const isoDay = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Pick a date.');
// A planned date: a real day from 2000 to two years ahead (a past one needs confirmPast, below).
const plannedDay = isoDay.superRefine((day, ctx) => {
  const problem = plannedDayProblem(day);
  if (problem) ctx.addIssue({ code: 'custom', message: problem });
});
const optionalPlannedDay = z.preprocess((v) => (v === '' ? null : v), plannedDay.nullable().optional());
const uuid = (what: string) => z.string().uuid(`Choose ${what}.`);

/** A planned date before today is kept only when the person ticked that it is in the past. */
function pastDayConfirmed(v: { plannedOn?: string | null; confirmPast: boolean }, ctx: z.RefinementCtx) {
  if (isPastDay(v.plannedOn) && !v.confirmPast) ctx.addIssue({ code: 'custom', path: ['plannedOn'], message: PAST_DAY_UNCONFIRMED });
}

export const visitCreateSchema = z
  .object({
    farmId: uuid('a farm'),
    advisorId: z.preprocess((v) => (v === '' ? null : v), uuid('an advisor').nullable().optional()),
    plannedOn: optionalPlannedDay,
    confirmPast: z.boolean().default(false),
    // Set after the person has read the warning that the farm already has a visit under way.
    confirmDuplicate: z.boolean().default(false),
    notes: z.string().trim().max(2000, 'Notes are at most 2,000 characters.').default(''),
  })
  .superRefine(pastDayConfirmed);
export type VisitCreateInput = z.input<typeof visitCreateSchema>;

const assignFields = {
  advisorId: uuid('an advisor'),
  plannedOn: plannedDay,
  confirmPast: z.boolean().default(false),
  // Set after the person has read the warning that the current advisor may hold unsynced data.
  confirmUnsynced: z.boolean().default(false),
};

export const visitAssignSchema = z.object(assignFields).superRefine(pastDayConfirmed);
export type VisitAssignInput = z.input<typeof visitAssignSchema>;

export const visitStatusSchema = z.object({
  status: z.enum(VISIT_STATUSES, { message: 'Choose a state.' }),
});

// A move outside the table of visit states: only with the coordinator's reason, which is audited.
export const visitJumpSchema = z.object({
  status: z.enum(VISIT_STATUSES, { message: 'Choose a state.' }),
  reason: z
    .string({ message: 'Say in a few words why the visit moves outside the usual order.' })
    .trim()
    .min(JUMP_REASON_MIN, 'Say in a few words why the visit moves outside the usual order.')
    .max(500, 'At most 500 characters.'),
});

export const bulkAssignSchema = z
  .object({
    ...assignFields,
    visitIds: z.array(z.string().uuid('A visit id is not valid.')).min(1, 'Tick at least one visit.').max(200, 'At most 200 visits at once.'),
  })
  .superRefine(pastDayConfirmed);
export type BulkAssignInput = z.input<typeof bulkAssignSchema>;

const coordinate = (min: number, max: number, what: string) =>
  z.preprocess(
    (v) => (v === '' || v === undefined ? null : typeof v === 'string' ? Number(v.trim().replace(',', '.')) : v),
    z
      .number({ message: `${what} must be a number.` })
      .min(min, `${what} is between ${min} and ${max}.`)
      .max(max, `${what} is between ${min} and ${max}.`)
      .nullable(),
  );

export const farmSchema = z.object({
  name: z.string().trim().min(1, 'Give the farm a name.').max(160, 'At most 160 characters.'),
  area: z.string().trim().max(160, 'At most 160 characters.').default(''),
  ownerId: z.preprocess((v) => (v === '' ? null : v), uuid('a farmer').nullable().default(null)),
  lat: coordinate(-90, 90, 'Latitude'),
  lon: coordinate(-180, 180, 'Longitude'),
  notes: z.string().trim().max(2000, 'Notes are at most 2,000 characters.').default(''),
});
export type FarmInput = z.input<typeof farmSchema>;

export const invitationSchema = z.object({
  name: z.string().trim().min(1, 'Enter the person’s name.').max(160, 'At most 160 characters.'),
  email: z.string().trim().toLowerCase().email('Enter an e-mail address like name@example.org.').max(254),
  role: z.enum(ROLES, { message: 'Choose coordinator, advisor or farmer.' }),
});
export type InvitationInput = z.input<typeof invitationSchema>;

export const acceptInvitationSchema = z
  .object({
    password: z.string().min(10, 'Use at least 10 characters.').max(200, 'At most 200 characters.'),
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { message: 'The two passwords differ.', path: ['confirm'] });
export type AcceptInvitationInput = z.input<typeof acceptInvitationSchema>;

export const personUpdateSchema = z.object({
  active: z.boolean({ message: 'Say whether the account is active.' }),
});

const positive = (what: string) =>
  z.preprocess(
    (v) => (typeof v === 'string' ? (v.trim() === '' ? undefined : Number(v.trim().replace(',', '.'))) : v),
    z.number({ message: `${what} must be a number.` }).positive(`${what} must be more than 0.`),
  );

/** Flags every own key of the raw record that is not a kind of the demand catalogue. */
function onlyCatalogueKinds(v: unknown, ctx: z.RefinementCtx): void {
  if (!v || typeof v !== 'object' || Array.isArray(v)) return;
  for (const key of Object.keys(v)) {
    if (!Object.hasOwn(DEMAND_CATALOGUE, key)) ctx.addIssue({ code: 'custom', path: [key], message: 'Not a demand kind the screen knows.' });
  }
}

/** The record without entries left blank (empty or spaces only, null, undefined). */
function withoutBlanks(v: Record<string, unknown>): Record<string, unknown> {
  return Object.fromEntries(Object.entries(v).filter(([, x]) => x !== null && x !== undefined && !(typeof x === 'string' && x.trim() === '')));
}

export const settingsSchema = z.object({
  unitsDefault: z.enum(UNIT_SYSTEMS, { message: 'Choose metric or US customary.' }),
  // The share of the lowest measured flow a design may take (the rest stays in the stream).
  designFractionOfLowest: z.preprocess(
    (v) => (typeof v === 'string' ? Number(v.trim().replace(',', '.')) : v),
    z.number({ message: 'Enter a fraction like 0.5.' }).min(0.1, 'At least 0.1 of the lowest flow.').max(0.9, 'At most 0.9: leave water in the stream.'),
  ),
  // Least chance of meeting the demand for a plain go (the engine's range).
  minProbabilityForGo: z.preprocess(
    (v) => (typeof v === 'string' ? (v.trim() === '' ? undefined : Number(v.trim().replace(',', '.'))) : v),
    z.number({ message: 'Enter a chance like 0.8.' }).min(0.5, 'At least 0.5: below that a go is a coin toss.').max(0.99, 'At most 0.99.').default(0.8),
  ),
  // Only kinds the catalogue itself holds (own keys: not "constructor" or "__proto__", which the
  // record would drop unseen); a blank box means "use the catalogue figure" and is dropped.
  demandFigures: z
    .custom<Record<string, string | number | null | undefined>>((v) => !!v && typeof v === 'object' && !Array.isArray(v), 'Give the per-head figures by kind.')
    .superRefine(onlyCatalogueKinds)
    .transform(withoutBlanks)
    .pipe(z.record(z.string().min(1), positive('A per-head figure'))),
  pipePrices: z
    .array(
      z.object({
        material: z.string().trim().min(1, 'Name the pipe material.').max(40),
        diameterMm: positive('Diameter'),
        pricePerM: positive('Price per metre'),
        currency: z.string().trim().min(1, 'Give a currency.').max(8),
      }),
    )
    .max(100, 'At most 100 pipe prices.'),
  // Prices for costing the sheet; absent keeps the stored list (or the invented defaults).
  priceList: priceListSchema.optional(),
});
export type SettingsInput = z.input<typeof settingsSchema>;
