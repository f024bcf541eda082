import { z } from 'zod';
import { limits } from '../validations';
import { GRIT_STANDARDS } from '../grit';

/** The query of a route that takes none: any parameter is an unknown field, refused with 400. */
export const emptyQuerySchema = z.object({}).strict();

/** A page's slug: lower-case letters, digits and single hyphens. */
export const slugSchema = z
  .string()
  .trim()
  .min(1, 'required')
  .max(limits.slugMax)
  .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'must be a slug: lower-case letters, digits and hyphens');

/** The path of a route that names a record by its numeric id (`/results/:id`). */
export const idParams = z.object({ id: z.coerce.number().int().positive() }).strict();

/** The path of a route that names a member by handle (`/profiles/:handle`). */
export const handleParams = z.object({ handle: z.string().min(1).max(limits.handleMax).regex(/^[a-z0-9-]+$/, 'not a handle') }).strict();

/** A grit as entered: the grade, optionally with its standard (else worked out from the grade). */
export const gritInputSchema = z
  .object({
    standard: z.enum(GRIT_STANDARDS).optional(),
    grade: z.string().trim().min(1, 'required').max(40),
  })
  .strict();
