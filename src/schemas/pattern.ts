import { z } from 'zod';
import { PatternVisibilitySchema, TermsSchema } from './common';
import { MaterialsSchema } from './materials';

// One schema for the pattern editor form (react-hook-form + zodResolver) and the API routes.
// Blank optional text ('') is accepted so the form can send its empty fields; the server stores it as null.

const optionalText = (max: number, what: string) =>
  z
    .string()
    .trim()
    .max(max, { message: `Keep the ${what} to at most ${max} characters.` })
    .optional()
    .nullable();

const WEB_LINK = /^https?:\/\/[^\s/$.?#][^\s]*$/i;

export const SourceUrlSchema = z
  .string()
  .trim()
  .max(2000, { message: 'That link is too long (at most 2000 characters).' })
  .refine((s) => s === '' || (WEB_LINK.test(s) && URL.canParse(s)), {
    message: 'Use a web link that starts with http:// or https://.',
  });

// Hook range matches HookSchema in ./materials (0.5–35 mm covers steel thread hooks to the largest jumbo hooks).
export const HookMmSchema = z
  .number({ message: 'Give the hook size in mm, e.g. 3.5.' })
  .min(0.5, { message: 'A hook is at least 0.5 mm.' })
  .max(35, { message: 'A hook is at most 35 mm.' });

export const GaugeSchema = z.object({
  stitches: z
    .number({ message: 'Give the number of stitches in the gauge.' })
    .positive({ message: 'Stitches in the gauge must be more than 0.' })
    .max(200, { message: 'That is more stitches than any gauge swatch holds (at most 200).' }),
  rows: z
    .number({ message: 'Give the number of rows in the gauge.' })
    .positive({ message: 'Rows in the gauge must be more than 0.' })
    .max(200, { message: 'That is more rows than any gauge swatch holds (at most 200).' }),
  over: z.enum(['10cm', '4in'], { message: 'Say whether the gauge is over 10 cm or 4 in.' }),
  stitch: z.string().trim().max(40, { message: 'Keep the gauge stitch short, e.g. "sc".' }).optional(),
  hookMm: HookMmSchema.optional(),
});
export type GaugeInput = z.infer<typeof GaugeSchema>;

export const PatternPieceInputSchema = z.object({
  /** Sent back by the editor for pieces that already exist, so their ids stay the same. */
  id: z.number().int().positive().optional(),
  name: z
    .string({ message: 'Give the piece a name, e.g. "Body".' })
    .trim()
    .min(1, { message: 'Give the piece a name, e.g. "Body".' })
    .max(80, { message: 'Keep the piece name to at most 80 characters.' }),
  instructions: z
    .string({ message: 'The instructions must be text.' })
    .max(50_000, {
      message:
        'These instructions are too long for one piece (at most 50,000 characters). Split them into pieces.',
    }),
  copies: z
    .number({ message: 'Say how many of this piece to make.' })
    .int({ message: 'Make a whole number of pieces.' })
    .min(1, { message: 'Make at least 1 of each piece.' })
    .max(100, { message: 'At most 100 copies of one piece.' }),
  hookMm: HookMmSchema.nullable().optional(),
  yarns: z
    .array(z.string().trim().min(1).max(120))
    .max(20, { message: 'At most 20 yarns per piece.' })
    .optional(),
});
export type PatternPieceInput = z.infer<typeof PatternPieceInputSchema>;

const fields = {
  title: z
    .string({ message: 'Give the pattern a title.' })
    .trim()
    .min(1, { message: 'Give the pattern a title.' })
    .max(160, { message: 'Keep the title to at most 160 characters.' }),
  terms: TermsSchema,
  designerCredit: optionalText(160, 'designer credit'),
  sourceUrl: SourceUrlSchema.optional().nullable(),
  gauge: GaugeSchema.nullable().optional(),
  skillNotes: optionalText(4000, 'skill notes'),
  pieces: z
    .array(PatternPieceInputSchema, { message: 'Pieces must be a list.' })
    .min(1, { message: 'Add at least one piece (for a one-piece pattern, call it "Main").' })
    .max(40, { message: 'At most 40 pieces in one pattern.' }),
  materials: MaterialsSchema.optional(),
  visibility: PatternVisibilitySchema.optional(),
};

export const CreatePatternSchema = z.object(fields);
export type CreatePatternInput = z.infer<typeof CreatePatternSchema>;
export type CreatePatternFormValues = z.input<typeof CreatePatternSchema>;

// PATCH: every field optional; `pieces`, when sent, replaces the pattern's pieces (ids kept where sent).
export const UpdatePatternSchema = z
  .object(fields)
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), {
    message: 'Send at least one field to change.',
  });
export type UpdatePatternInput = z.infer<typeof UpdatePatternSchema>;

export const patternVisibilityLabels = {
  private: 'Private',
  testers: 'Shared with testers',
  public: 'Public',
} as const;
