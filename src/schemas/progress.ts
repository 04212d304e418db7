import { z } from 'zod';

// The Tally's wire format: one event per tap, shared by the API route and the client's outbox.

/** A position in a piece: 1-based copy, 0-based index into the engine's rounds, steps done in that round. */
export const PositionSchema = z
  .object({
    copy: z.number({ message: 'copy is a whole number from 1.' }).int().min(1, { message: 'Copies are counted from 1.' }),
    round: z.number({ message: 'round is a whole number from 0.' }).int().min(0, { message: 'round is the 0-based index of a round.' }),
    step: z.number({ message: 'step is a whole number from 0.' }).int().min(0, { message: 'step counts the steps done, from 0.' }),
  })
  .strict();

export const progressActions = ['step', 'undo', 'round', 'set'] as const;
export type ProgressAction = (typeof progressActions)[number];

/** Client-made ids (crypto.randomUUID on the device); anything plain and short is accepted. */
export const OpIdSchema = z
  .string({ message: 'opId is the id the device made for this tap.' })
  .min(8, { message: 'opId is at least 8 characters.' })
  .max(100, { message: 'opId is at most 100 characters.' })
  .regex(/^[A-Za-z0-9_.:-]+$/, { message: 'opId uses letters, digits, "-", "_", "." or ":" only.' });

export const ProgressOpSchema = z
  .object({
    opId: OpIdSchema,
    action: z.enum(progressActions, { message: 'action is one of step, undo, round or set.' }),
    /** When the maker tapped, by the device's clock (kept for history; the server's order decides). */
    at: z.iso.datetime({ message: 'at is an ISO date-time like 2026-12-01T18:30:00.000Z.' }).optional(),
    to: PositionSchema.optional(),
  })
  .strict()
  .refine((v) => v.action !== 'set' || v.to !== undefined, { message: 'A "set" needs to: { copy, round, step }.', path: ['to'] })
  .refine((v) => v.action === 'set' || v.to === undefined, { message: 'Only a "set" takes a position in to.', path: ['to'] });
export type ProgressOp = z.infer<typeof ProgressOpSchema>;

export const PlacementInputSchema = z
  .object({
    /** The round number as labelled in the pattern ("Rnd 9" → 9). */
    round: z.number({ message: 'round is the round number as the pattern labels it.' }).int().min(0).max(10_000),
    step: z.number({ message: 'step is a whole number.' }).int().min(0).max(100_000).nullable().optional(),
    copy: z.number({ message: 'copy is a whole number from 1.' }).int().min(1).max(1000).optional(),
    label: z
      .string({ message: 'Say what was placed, like "left eye".' })
      .trim()
      .min(1, { message: 'Say what was placed, like "left eye".' })
      .max(80, { message: 'Keep the label under 80 characters.' }),
    note: z.string().trim().max(500, { message: 'Keep the note under 500 characters.' }).nullable().optional(),
    /** Lets a device replay a queued mark without adding it twice. */
    opId: OpIdSchema.optional(),
  })
  .strict();
export type PlacementInput = z.infer<typeof PlacementInputSchema>;

/** The mark-here form on the Tally (the same rules as the API for what a person types). */
export const PlacementFormSchema = PlacementInputSchema.pick({ label: true }).extend({
  note: z.string().trim().max(500, { message: 'Keep the note under 500 characters.' }),
});
export type PlacementFormValues = z.input<typeof PlacementFormSchema>;
