import { z } from 'zod';

// The hook roll: the maker's own hooks. Pure zod, shared by the API and the hook form.

export const HookMaterialSchema = z.enum(['aluminium', 'steel', 'wood', 'bamboo', 'plastic', 'ergonomic', 'other'], {
  message: 'Pick a material from the list, or leave it blank.',
});
export type HookMaterial = z.infer<typeof HookMaterialSchema>;
export const hookMaterialLabels: Record<HookMaterial, string> = {
  aluminium: 'Aluminium',
  steel: 'Steel',
  wood: 'Wood',
  bamboo: 'Bamboo',
  plastic: 'Plastic',
  ergonomic: 'Ergonomic handle',
  other: 'Other',
};

// Same bounds as a piece's hook (src/schemas/project.ts), so any hook a piece can ask for can be in the roll.
// Two decimals are enough for every size in use (e.g. 15.75 mm, 1.65 mm steel).
export const HookSizeMm = z
  .number({ message: 'Give the size in millimetres, like 3.5.' })
  .min(0.5, { message: 'A hook is at least 0.5 mm.' })
  .max(35, { message: 'A hook is at most 35 mm.' })
  .refine((mm) => Math.abs(mm * 100 - Math.round(mm * 100)) < 1e-6, { message: 'Give the size to at most two decimals, like 3.75.' });

const text = (max: number) => z.string().trim().max(max, { message: `Keep it under ${max} characters.` });

const onlyKnown = { error: (issue: { code?: string }) => (issue.code === 'unrecognized_keys' ? 'Send only the size, material, brand, note and how many.' : undefined) };

const HookFields = z.strictObject(
  {
    mm: HookSizeMm,
    material: HookMaterialSchema.nullable().optional(),
    brand: text(80).nullable().optional(),
    note: text(500).nullable().optional(),
    quantity: z
      .number({ message: 'How many is a number.' })
      .int({ message: 'How many is a whole number.' })
      .min(1, { message: 'At least 1 — delete the hook if you no longer have it.' })
      .max(99, { message: 'At most 99 of one hook.' }),
  },
  onlyKnown,
);

export const HookInputSchema = HookFields.extend({ quantity: HookFields.shape.quantity.default(1) });
export type HookRollInput = z.input<typeof HookInputSchema>;

export const UpdateHookSchema = HookFields.partial()
  .refine((v) => Object.keys(v).length > 0, { message: 'Send at least one thing to change.' });
export type UpdateHookInput = z.input<typeof UpdateHookSchema>;
