import * as z from '@/lib/shared/zod';
import { formatWhole } from '../display/numbers';
import { DEMAND_CATALOGUE, type DemandKind } from '@/lib/engine/demand';
import { NOTE_MAX } from '../sheet/email';
import {
  ANSWER_TOO_LONG,
  ANSWER_TOO_SHORT,
  QUESTION_MAX,
  QUESTION_MIN,
  QUESTION_TOO_LONG,
  QUESTION_TOO_SHORT,
  REASON_MAX,
  REASON_NEEDED,
  REASON_TOO_LONG,
} from '../sheet/question-rules';
import { parseFieldNumber } from '../units';

// Bodies and queries of the sheet routes, shared by the forms and the handlers.
export const PAPERS = ['a4', 'letter'] as const;
export type PaperSize = (typeof PAPERS)[number];

export const paperQuery = z.object({
  paper: z.enum(PAPERS, { message: 'Paper must be a4 or letter.' }).optional(),
});

export const sendSheetBody = z.object({
  to: z.string().trim().email('Enter a valid e-mail address, like name@example.org.').max(254).optional(),
  paper: z.enum(PAPERS, { message: 'Paper must be a4 or letter.' }).optional(),
  note: z
    .string()
    .trim()
    .max(NOTE_MAX, `Keep the note under ${formatWhole(NOTE_MAX)} characters.`)
    .optional(),
});
export type SendSheetBody = z.infer<typeof sendSheetBody>;

export const questionBody = z.object({
  text: z.string().trim().min(QUESTION_MIN, QUESTION_TOO_SHORT).max(QUESTION_MAX, QUESTION_TOO_LONG),
});

export const answerBody = z.object({
  questionId: z.string().uuid('Choose a question on this sheet.'),
  text: z.string().trim().min(QUESTION_MIN, ANSWER_TOO_SHORT).max(QUESTION_MAX, ANSWER_TOO_LONG),
});

// The farmer's decision: "go ahead" (a note is optional) or "not now" with a reason.
export const decisionBody = z
  .object({
    decision: z.enum(['go-ahead', 'not-now'], { message: 'Choose go ahead or not now.' }),
    reason: z.string().trim().max(REASON_MAX, REASON_TOO_LONG).default(''),
  })
  .refine((b) => b.decision === 'go-ahead' || b.reason.length >= QUESTION_MIN, { message: REASON_NEEDED, path: ['reason'] });

/** Animal kinds a farmer can pick (people and garden have their own fields). */
export const ANIMAL_KINDS = (Object.keys(DEMAND_CATALOGUE) as DemandKind[]).filter((k) => !k.startsWith('person') && k !== 'garden-m2');
export const HOUSEHOLD_KIND: DemandKind = 'person-tap-on-plot';

// Form fields arrive as typed text ("12", "0,5", ""); JSON bodies as numbers. Empty counts as 0.
const fieldNumber = (value: unknown): unknown => {
  if (typeof value !== 'string') return value;
  if (value.trim() === '') return 0;
  const parsed = parseFieldNumber(value);
  return parsed.ok ? parsed.value : Number.NaN;
};

const wholeCount = (what: string, max: number) =>
  z.preprocess(
    fieldNumber,
    z
      .number({ message: `Enter how many ${what}, as a number.` })
      .int(`The number of ${what} must be a whole number.`)
      .min(0, `The number of ${what} cannot be negative.`)
      .max(max, `At most ${formatWhole(max)} ${what}.`),
  );

export const farmNeedsBody = z
  .object({
    people: wholeCount('people', 500),
    animals: z
      .array(
        z.object({
          kind: z.enum(ANIMAL_KINDS as [DemandKind, ...DemandKind[]], { message: 'Pick a kind of animal from the list.' }),
          count: wholeCount('animals', 100_000),
        }),
      )
      .max(20, 'At most 20 kinds of animal.'),
    gardenArea: z.preprocess(
      fieldNumber,
      z
        .number({ message: 'Enter the garden area as a number (0 for none).' })
        .min(0, 'The garden area cannot be negative.')
        .max(1_000_000, 'That garden is larger than a square kilometre: check the number.'),
    ),
    gardenUnit: z.enum(['m2', 'ft2']),
    tankSite: z.string().trim().max(300, 'Keep the tank place under 300 characters.'),
  })
  .refine((b) => new Set(b.animals.map((a) => a.kind)).size === b.animals.length, {
    message: 'Each kind of animal once, please: add the numbers together.',
    path: ['animals'],
  });
export type FarmNeedsBody = z.infer<typeof farmNeedsBody>;
