import { z } from '@/lib/shared/zod';
import { ROLES, UNIT_SYSTEMS, VISIT_STATUSES } from '../domain';
import { isDemandKind } from '../demand-kinds';
import { isoDay as boundedDay } from './bounds';

// Bodies of the coordinator's office routes; the forms use the same schemas (zodResolver).

const isoDay = boundedDay('Pick a date.');
const optionalDay = z.preprocess((v) => (v === '' ? null : v), isoDay.nullable().optional());
const uuid = (what: string) => z.string().uuid(`Choose ${what}.`);

export const visitCreateSchema = z.object({
  farmId: uuid('a farm'),
  advisorId: z.preprocess((v) => (v === '' ? null : v), uuid('an advisor').nullable().optional()),
  plannedOn: optionalDay,
  notes: z.string().trim().max(2000, 'Notes are at most 2,000 characters.').default(''),
});
export type VisitCreateInput = z.input<typeof visitCreateSchema>;

export const visitAssignSchema = z.object({
  advisorId: uuid('an advisor'),
  plannedOn: isoDay,
  // Set after the person has read the warning that the current advisor may hold unsynced data.
  confirmUnsynced: z.boolean().default(false),
});
export type VisitAssignInput = z.input<typeof visitAssignSchema>;

export const visitStatusSchema = z.object({
  status: z.enum(VISIT_STATUSES, { message: 'Choose a state.' }),
});

export const bulkAssignSchema = visitAssignSchema.extend({
  visitIds: z.array(z.string().uuid('A visit id is not valid.')).min(1, 'Tick at least one visit.').max(200, 'At most 200 visits at once.'),
});
export type BulkAssignInput = z.input<typeof bulkAssignSchema>;

const coordinate = (min: number, max: number, what: string) =>
  z.preprocess(
    (v) => (v === '' || v === undefined ? null : typeof v === 'string' ? Number(v.trim().replace(',', '.')) : v),
    z.number({ message: `${what} must be a number.` }).min(min, `${what} is between ${min} and ${max}.`).max(max, `${what} is between ${min} and ${max}.`).nullable(),
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

export const acceptInvitationSchema = z.object({
  password: z.string().min(10, 'Use at least 10 characters.').max(200, 'At most 200 characters.'),
  confirm: z.string(),
}).refine((v) => v.password === v.confirm, { message: 'The two passwords differ.', path: ['confirm'] });
export type AcceptInvitationInput = z.input<typeof acceptInvitationSchema>;

export const personUpdateSchema = z.object({
  active: z.boolean({ message: 'Say whether the account is active.' }),
});

const positive = (what: string) =>
  z.preprocess(
    (v) => (typeof v === 'string' ? (v.trim() === '' ? undefined : Number(v.trim().replace(',', '.'))) : v),
    z.number({ message: `${what} must be a number.` }).positive(`${what} must be more than 0.`),
  );

export const settingsSchema = z.object({
  unitsDefault: z.enum(UNIT_SYSTEMS, { message: 'Choose metric or US customary.' }),
  // The share of the lowest measured flow a design may take (the rest stays in the stream).
  designFractionOfLowest: z.preprocess(
    (v) => (typeof v === 'string' ? Number(v.trim().replace(',', '.')) : v),
    z.number({ message: 'Enter a fraction like 0.5.' }).min(0.1, 'At least 0.1 of the lowest flow.').max(0.9, 'At most 0.9: leave water in the stream.'),
  ),
  demandFigures: z.record(z.string().refine(isDemandKind), positive('A per-head figure'), {
    error: (issue) => (issue.code === 'invalid_key' ? 'Not a demand kind the screen knows.' : undefined),
  }),
  pipePrices: z.array(z.object({
    material: z.string().trim().min(1, 'Name the pipe material.').max(40),
    diameterMm: positive('Diameter'),
    pricePerM: positive('Price per metre'),
    currency: z.string().trim().min(1, 'Give a currency.').max(8),
  })).max(100, 'At most 100 pipe prices.'),
});
export type SettingsInput = z.input<typeof settingsSchema>;
