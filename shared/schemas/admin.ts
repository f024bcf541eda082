import { z } from 'zod';
import { ROLES } from '../permissions';
import { limits } from '../validations';

/** GET /api/admin/users: accounts whose handle or name contains `q`, a page at a time. */
export const adminUsersQuerySchema = z
  .object({
    q: z.string().trim().max(limits.handleMax).optional(),
    page: z.coerce.number().int().min(1).max(10_000).default(1),
  })
  .strict();

/** PATCH /api/admin/users/:handle: a new role, a ban or its lifting, and always the reason (audited). */
export const adminUserChangeSchema = z
  .object({
    role: z.enum(ROLES).optional(),
    banned: z.boolean().optional(),
    reason: z.string().trim().min(1, 'say why: the audit log keeps it').max(limits.noteMax),
  })
  .strict()
  .refine((v) => v.role !== undefined || v.banned !== undefined, { path: ['role'], message: 'give a new role, or banned true or false' });
export type AdminUserChange = z.infer<typeof adminUserChangeSchema>;

export const handleParamsSchema = z.object({ handle: z.string().min(1).max(limits.handleMax) }).strict();
