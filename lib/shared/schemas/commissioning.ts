// What the advisor measures at an installed ram: one shape for the form and the route.
import * as z from '@/lib/shared/zod';
import { PIPE_MATERIALS, type PipeMaterialId } from '@/lib/engine/materials';
import { MAX_WASTE_VALVE_STROKE_MM } from '../reading-limits';

const measured = (label: string, max: number) =>
  z
    .number({ error: (issue) => (issue.input === undefined ? `${label} is needed` : `${label} must be a number`) })
    .positive(`${label} must be more than 0`)
    .max(max, `${label} must be at most ${max}`);

export const commissioningInputSchema = z
  .object({
    driveLpm: measured('Drive flow', 100_000),
    deliveredLpm: measured('Delivered flow', 100_000),
    beatsPerMinute: measured('Beats per minute', 1_000),
    liftM: measured('Lift', 2_000),
    /** Fall measured at installation; without it the screening's fall is used. */
    fallM: measured('Fall', 500).optional(),
    /** The waste valve's stroke as set (the usual range is 10–25 mm); without it the advice assumes 15 mm. */
    wasteValveStrokeMm: measured('Waste valve stroke (mm)', MAX_WASTE_VALVE_STROKE_MM).optional(),
    drivePipeMaterial: z
      .enum(Object.keys(PIPE_MATERIALS) as [PipeMaterialId, ...PipeMaterialId[]], { error: 'Choose a drive pipe material from the list' })
      .optional(),
    notes: z.string().max(5000, 'Notes: at most 5000 characters').default(''),
  })
  .strict()
  .refine((v) => v.deliveredLpm < v.driveLpm, { message: 'Delivered flow must be less than the drive flow', path: ['deliveredLpm'] })
  .refine((v) => v.fallM === undefined || v.liftM > v.fallM, { message: 'Lift must be more than the fall', path: ['liftM'] });

export type CommissioningInput = z.output<typeof commissioningInputSchema>;
