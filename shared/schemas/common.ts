import { z } from 'zod';

/** The query of a route that takes none: any parameter is an unknown field, refused with 400. */
export const emptyQuerySchema = z.object({}).strict();
