import { z } from 'zod';

export const TermsSchema = z.enum(['us', 'uk']);
export const ProjectStatusSchema = z.enum(['planned', 'on_the_hook', 'resting', 'finished', 'frogged']);
export type ProjectStatus = z.infer<typeof ProjectStatusSchema>;
export const projectStatusLabels: Record<ProjectStatus, string> = {
  planned: 'Planned',
  on_the_hook: 'On the hook',
  resting: 'Resting',
  finished: 'Finished',
  frogged: 'Frogged',
};
export const ProjectVisibilitySchema = z.enum(['private', 'link', 'public']);
export const PatternVisibilitySchema = z.enum(['private', 'testers', 'public']);

/** Route ids are positive integers; anything else is a 404-worthy address, answered as a 422 with a sentence. */
export const IdParam = z.coerce.number({ message: 'That id is not a number.' }).int().positive();
export const IdParamsSchema = z.object({ id: IdParam });
