import { z } from 'zod';
import { DEFECTS, FLAVOUR_DESCRIPTORS } from '../constants/tasting';

const score = (what: string) =>
  z
    .number({ error: `Score ${what} from 1 to 9.` })
    .int(`Score ${what} with a whole number from 1 to 9.`)
    .min(1, `Score ${what} from 1 to 9.`)
    .max(9, `Score ${what} from 1 to 9.`);

const descriptorKeys = FLAVOUR_DESCRIPTORS.map((d) => d.key) as [string, ...string[]];
const defectKeys = DEFECTS.map((d) => d.key) as [string, ...string[]];

/** One scorecard: overall liking and five attributes on the 9-point hedonic scale. */
export const tastingInputSchema = z.object({
  tastedOn: z
    .string({ error: 'Enter the tasting date.' })
    .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2026-03-14.')
    .refine((v) => !Number.isNaN(Date.parse(`${v}T00:00:00Z`)), 'That date does not exist.'),
  overall: score('overall liking'),
  appearance: score('appearance'),
  aroma: score('aroma'),
  flavour: score('flavour'),
  texture: score('body and texture'),
  finish: score('finish'),
  descriptors: z
    .array(z.enum(descriptorKeys, { error: 'Choose descriptors from the list.' }))
    .max(descriptorKeys.length)
    .default([]),
  defects: z
    .array(z.enum(defectKeys, { error: 'Choose defects from the list.' }))
    .max(defectKeys.length)
    .default([]),
  notes: z.string().max(5000, 'Use at most 5000 characters.').default(''),
  /** The invite code when scoring someone else's wheel at a meeting. */
  invite: z.string().trim().max(64).optional(),
});

export const tastingUpdateSchema = tastingInputSchema.omit({ invite: true }).partial();

export type TastingInput = z.infer<typeof tastingInputSchema>;
