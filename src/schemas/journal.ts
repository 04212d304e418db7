import { z } from 'zod';

// Journal entries and photo edits: shared by the API routes and the entry form.

export const JournalTagSchema = z.enum(['progress', 'change', 'placement', 'problem', 'finished']);
export type JournalTag = z.infer<typeof JournalTagSchema>;
export const journalTags = JournalTagSchema.options;
export const journalTagLabels: Record<JournalTag, string> = {
  progress: 'Progress',
  change: 'Change from the pattern',
  placement: 'Placement',
  problem: 'Problem',
  finished: 'Finished',
};

/** A maker writes a day's notes and may paste a long pattern change; a whole chapter is more than a note. */
export const ENTRY_BODY_MAX = 10_000;
/** A working day at most: more than 24 hours on one entry is a typo. */
export const ENTRY_MINUTES_MAX = 24 * 60;

const isRealDate = (s: string) => {
  const d = new Date(`${s}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
};

export const EntryDateSchema = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, { message: 'Use a date like 2026-11-24.' })
  .refine(isRealDate, { message: 'That day does not exist on the calendar.' });

const Body = z
  .string({ message: 'Write a few words about what you did.' })
  .trim()
  .min(1, { message: 'Write a few words about what you did.' })
  .max(ENTRY_BODY_MAX, { message: `Keep an entry under ${ENTRY_BODY_MAX.toLocaleString('en')} characters.` });

const Minutes = z
  .number({ message: 'Working time is a number of minutes.' })
  .int({ message: 'Working time is a whole number of minutes.' })
  .min(0, { message: 'Working time cannot be negative.' })
  .max(ENTRY_MINUTES_MAX, { message: 'Working time on one entry is at most 24 hours (1440 minutes).' });

const Tags = z
  .array(JournalTagSchema, { message: 'Tags are a list.' })
  .max(journalTags.length)
  .transform((tags) => [...new Set(tags)]);

const PieceId = z.number({ message: 'Choose a piece from the list.' }).int().positive();

export const CreateEntrySchema = z
  .object({
    body: Body,
    pieceId: PieceId.nullable().optional(),
    tags: Tags.optional(),
    minutes: Minutes.nullable().optional(),
    entryDate: EntryDateSchema.optional(),
    onShowcase: z.boolean().optional(),
  })
  .strict();
export type CreateEntryInput = z.input<typeof CreateEntrySchema>;

export const UpdateEntrySchema = z
  .object({
    body: Body.optional(),
    pieceId: PieceId.nullable().optional(),
    tags: Tags.optional(),
    minutes: Minutes.nullable().optional(),
    entryDate: EntryDateSchema.optional(),
    onShowcase: z.boolean().optional(),
  })
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Change at least one thing before saving.' });
export type UpdateEntryInput = z.input<typeof UpdateEntrySchema>;

export const EntryListQuerySchema = z.object({
  pieceId: z.coerce.number({ message: 'That piece id is not a number.' }).int().positive().optional(),
});

export const ALT_MAX = 300;
export const UpdatePhotoSchema = z
  .object({
    alt: z
      .string()
      .trim()
      .min(1, { message: 'Describe the photo in a few words for people who cannot see it.' })
      .max(ALT_MAX, { message: `Keep the description under ${ALT_MAX} characters.` })
      .optional(),
    /** true makes it the project's cover; false clears the cover if it was this photo. */
    cover: z.boolean().optional(),
  })
  .strict()
  .refine((v) => v.alt !== undefined || v.cover !== undefined, { message: 'Change the description or the cover.' });
export type UpdatePhotoInput = z.input<typeof UpdatePhotoSchema>;

/** Shared with the client so the picker can say the same thing before uploading. */
export const PHOTO_LIMITS = {
  maxFileBytes: 15 * 1024 * 1024,
  maxFiles: 8,
  maxMegapixels: 40,
  maxSide: 10_000,
  displayLongSide: 1600,
  thumbSide: 400,
} as const;
