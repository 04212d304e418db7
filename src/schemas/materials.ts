import { z } from 'zod';

// Materials shared by patterns, projects and the yarn shelf. Weight is the Craft Yarn Council category 0–7.

export const YarnWeightCategory = z.number().int().min(0).max(7);

export const YarnSchema = z.object({
  name: z.string().trim().min(1, { message: 'Give the yarn a name.' }).max(120),
  colour: z.string().trim().max(80).optional(),
  fibre: z.string().trim().max(80).optional(),
  weight: YarnWeightCategory.optional(),
  /** As written on the ball band, e.g. "8 ply"; mapped to a weight category where known. */
  ply: z.string().trim().max(20).optional(),
  metersPerSkein: z.number().positive().max(100_000).optional(),
  yardsPerSkein: z.number().positive().max(100_000).optional(),
  /** Projects: how much was used, in skeins or meters. */
  skeinsUsed: z.number().min(0).max(10_000).optional(),
  metersUsed: z.number().min(0).max(1_000_000).optional(),
  /** Projects: the yarn shelf entry this came from. */
  shelfYarnId: z.number().int().positive().optional(),
});
export type Yarn = z.infer<typeof YarnSchema>;

export const HookSchema = z.object({
  mm: z.number({ message: 'Give the hook size in mm.' }).min(0.5, { message: 'A hook is at least 0.5 mm.' }).max(35, { message: 'A hook is at most 35 mm.' }),
  note: z.string().trim().max(120).optional(),
});
export type HookInput = z.infer<typeof HookSchema>;

export const NotionKind = z.enum(['safety_eyes', 'stuffing', 'stitch_markers', 'tapestry_needle', 'pins', 'buttons', 'beads', 'other']);
export type NotionKind = z.infer<typeof NotionKind>;
export const notionLabels: Record<NotionKind, string> = {
  safety_eyes: 'Safety eyes',
  stuffing: 'Stuffing',
  stitch_markers: 'Stitch markers',
  tapestry_needle: 'Tapestry needle',
  pins: 'Pins',
  buttons: 'Buttons',
  beads: 'Beads',
  other: 'Other',
};

export const NotionSchema = z.object({
  kind: NotionKind,
  sizeMm: z.number().positive().max(200).optional(),
  quantity: z.number().int().min(0).max(100_000).optional(),
  note: z.string().trim().max(200).optional(),
});
export type Notion = z.infer<typeof NotionSchema>;

export const MaterialsSchema = z.object({
  yarns: z.array(YarnSchema).max(50).default([]),
  hooks: z.array(HookSchema).max(20).default([]),
  notions: z.array(NotionSchema).max(50).default([]),
});
export type Materials = z.infer<typeof MaterialsSchema>;
