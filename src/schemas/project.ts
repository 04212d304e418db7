import { z } from 'zod';
import { MaterialsSchema, NotionSchema } from './materials';
import { ProjectStatusSchema, ProjectVisibilitySchema, TermsSchema } from './common';

// Projects: what a maker is making. Shared by the API routes and the project forms.

const IsoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { message: 'Use a date like 2026-11-24.' });
const optionalText = (max: number) => z.string().trim().max(max, { message: `Keep it under ${max} characters.` });
// A change to materials: only the lists sent are replaced (no defaults, so a missing list is left alone).
const MaterialsPatchSchema = z
  .object({
    yarns: MaterialsSchema.shape.yarns.unwrap().optional(),
    hooks: MaterialsSchema.shape.hooks.unwrap().optional(),
    notions: MaterialsSchema.shape.notions.unwrap().optional(),
  })
  .strict();
const Title = z.string().trim().min(1, { message: 'Give the project a title.' }).max(120, { message: 'Keep the title under 120 characters.' });

// How many to make, as typed in a form: required there (the API defaults it to 1).
const Copies = z.coerce
  .number({ message: 'How many to make is a number.' })
  .int({ message: 'How many to make is a whole number.' })
  .min(1, { message: 'Make at least 1.' })
  .max(50, { message: 'At most 50 copies of one piece.' });
const YarnName = z.string().trim().min(1, { message: 'A yarn needs a name.' }).max(120, { message: 'Keep a yarn name under 120 characters.' });

export const ProjectPieceInputSchema = z.object({
  name: z.string().trim().min(1, { message: 'Give the piece a name, like "Body" or "Ear".' }).max(80, { message: 'Keep the piece name under 80 characters.' }),
  instructions: z.string().max(20_000, { message: 'Instructions are limited to 20,000 characters per piece.' }).default(''),
  copies: Copies.default(1),
  hookMm: z
    .number({ message: 'Give the hook in millimetres, like 3.5.' })
    .min(0.5, { message: 'A hook is at least 0.5 mm.' })
    .max(35, { message: 'A hook is at most 35 mm.' })
    .nullable()
    .optional(),
  yarns: z.array(YarnName).max(20, { message: 'At most 20 yarns for one piece.' }).optional(),
});
export type ProjectPieceInput = z.input<typeof ProjectPieceInputSchema>;

export const CreateProjectSchema = z
  .object({
    title: Title,
    patternId: z.number().int().positive().optional(),
    pieces: z.array(ProjectPieceInputSchema).max(40, { message: 'At most 40 pieces in one project.' }).optional(),
    forYoungChild: z.boolean().optional(),
    /** Stored in materials.notions; accepted here too because that is how most makers think of them. */
    notions: z.array(NotionSchema).max(50).optional(),
    materials: MaterialsPatchSchema.optional(),
    status: ProjectStatusSchema.optional(),
    terms: TermsSchema.optional(),
    startedOn: IsoDate.nullable().optional(),
    finishedOn: IsoDate.nullable().optional(),
    recipient: optionalText(120).nullable().optional(),
    notes: optionalText(10_000).nullable().optional(),
  })
  .strict()
  .refine((v) => !(v.patternId && v.pieces?.length), {
    message: 'Start from a pattern or type your own pieces, not both.',
    path: ['pieces'],
  });
export type CreateProjectInput = z.input<typeof CreateProjectSchema>;

/** A piece in an edit: with an id it changes that piece, without one it is added; pieces left out are removed. */
// Fields left out of an existing piece stay as they are, so no defaults here.
export const ProjectPieceEditSchema = ProjectPieceInputSchema.extend({
  id: z.number().int().positive().optional(),
  instructions: ProjectPieceInputSchema.shape.instructions.unwrap().optional(),
  copies: ProjectPieceInputSchema.shape.copies.unwrap().optional(),
});

export const UpdateProjectSchema = z
  .object({
    title: Title.optional(),
    status: ProjectStatusSchema.optional(),
    terms: TermsSchema.optional(),
    forYoungChild: z.boolean().optional(),
    notions: z.array(NotionSchema).max(50).optional(),
    materials: MaterialsPatchSchema.optional(),
    startedOn: IsoDate.nullable().optional(),
    finishedOn: IsoDate.nullable().optional(),
    recipient: optionalText(120).nullable().optional(),
    notes: optionalText(10_000).nullable().optional(),
    visibility: ProjectVisibilitySchema.optional(),
    pieces: z.array(ProjectPieceEditSchema).max(40, { message: 'At most 40 pieces in one project.' }).optional(),
  })
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Send at least one thing to change.' });
export type UpdateProjectInput = z.input<typeof UpdateProjectSchema>;

export const ProjectListQuerySchema = z.object({ status: ProjectStatusSchema.optional() });

/** The new-project form: pieces and notions typed in, or prefilled from a pattern. */
export const NewProjectFormSchema = z.object({
  title: Title,
  recipient: optionalText(120).optional(),
  forYoungChild: z.boolean(),
  status: ProjectStatusSchema,
  pieces: z.array(ProjectPieceInputSchema.extend({ copies: Copies })).max(40),
  notions: z.array(NotionSchema).max(50),
  notes: optionalText(10_000).optional(),
});
export type NewProjectFormValues = z.input<typeof NewProjectFormSchema>;

/** One piece as the project page edits it (every field shown); sent on as one of UpdateProjectSchema's pieces. */
export const ProjectPieceFormSchema = ProjectPieceInputSchema.extend({
  id: z.number().int().positive().optional(),
  copies: Copies,
  instructions: ProjectPieceInputSchema.shape.instructions.unwrap(),
  hookMm: ProjectPieceInputSchema.shape.hookMm.unwrap(),
  yarns: z.array(YarnName).max(20, { message: 'At most 20 yarns for one piece.' }),
});
export type ProjectPieceFormValues = z.input<typeof ProjectPieceFormSchema>;
export type ProjectPieceFormOutput = z.output<typeof ProjectPieceFormSchema>;
