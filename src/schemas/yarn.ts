import { z } from 'zod';
import { YarnWeightCategory } from './materials';

// The yarn shelf: the maker's own yarns, with how much is left after what projects used.

const text = (max: number) => z.string().trim().max(max, { message: `Keep it under ${max} characters.` });

const ShelfYarnFields = z
  .object({
    name: z.string().trim().min(1, { message: 'Give the yarn a name.' }).max(120, { message: 'Keep the name under 120 characters.' }),
    colour: text(80).nullable().optional(),
    fibre: text(80).nullable().optional(),
    weight: YarnWeightCategory.nullable().optional(),
    ply: text(20).nullable().optional(),
    metersPerSkein: z.number().positive({ message: 'Meters per skein is more than 0.' }).max(100_000).nullable().optional(),
    yardsPerSkein: z.number().positive({ message: 'Yards per skein is more than 0.' }).max(100_000).nullable().optional(),
    skeinsOwned: z.number({ message: 'Skeins owned is a number.' }).min(0, { message: 'Skeins owned cannot be negative.' }).max(10_000, { message: 'At most 10,000 skeins.' }),
    notes: text(2_000).nullable().optional(),
  })
  .strict();

export const ShelfYarnInputSchema = ShelfYarnFields.extend({ skeinsOwned: ShelfYarnFields.shape.skeinsOwned.default(1) });
export type ShelfYarnInput = z.input<typeof ShelfYarnInputSchema>;

export const UpdateShelfYarnSchema = ShelfYarnFields.partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Send at least one thing to change.' });
export type UpdateShelfYarnInput = z.input<typeof UpdateShelfYarnSchema>;
