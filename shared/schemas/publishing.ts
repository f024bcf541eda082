import { z } from 'zod';
import { limits } from '../validations';
import { slugSchema } from './result';

/** A web address people can follow: http or https only. */
const webLink = z
  .string()
  .trim()
  .max(300, 'must be at most 300 characters')
  .url('must be a web address, e.g. https://example.test')
  .refine((u) => /^https?:\/\//i.test(u), 'must start with http:// or https://');

/** A member's application to become a publisher. */
export const publisherApplicationSchema = z
  .object({
    workshop: z.string().trim().min(2, 'name your workshop or lab').max(120),
    instruments: z.string().trim().min(2, 'say which instruments you measure with').max(1000),
    link: webLink,
  })
  .strict();
export type PublisherApplicationInput = z.infer<typeof publisherApplicationSchema>;

/** An admin's decision on an application; a decline needs a reason the applicant will read. */
export const applicationDecisionSchema = z
  .object({
    decision: z.enum(['approve', 'decline']),
    note: z.string().trim().max(limits.noteMax).optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.decision === 'decline' && !v.note) ctx.addIssue({ code: 'custom', path: ['note'], message: 'say why the application is declined' });
  });
export type ApplicationDecisionInput = z.infer<typeof applicationDecisionSchema>;

/** States of a publisher application. */
export const APPLICATION_STATUSES = ['pending', 'approved', 'declined'] as const;
export type ApplicationStatus = (typeof APPLICATION_STATUSES)[number];

export const applicationListQuerySchema = z.object({ status: z.enum(APPLICATION_STATUSES).optional() }).strict();

/** A new API token: only its name is chosen. */
export const tokenCreateSchema = z.object({ name: z.string().trim().min(1, 'name the token, e.g. "lab laptop"').max(60) }).strict();

/** The text fields of a photo upload (multipart). */
export const photoFieldsSchema = z
  .object({ alt: z.string().trim().min(3, 'describe the photo for people who cannot see it').max(300) })
  .strict();

/** How many photos one result may carry, and the largest upload, bytes. */
export const photoLimits = { perResult: 6, fileBytesMax: 8 * 1024 * 1024, pixelsMax: 50_000_000 } as const;

/** What a flagged item can be. */
export const FLAG_SUBJECTS = ['result', 'steel', 'abrasive', 'method'] as const;
export type FlagSubject = (typeof FLAG_SUBJECTS)[number];

/** Why something is flagged, with the words shown to people. */
export const FLAG_REASONS = {
  'implausible-figures': 'Figures look wrong or implausible',
  duplicate: 'Duplicate of another entry',
  'missing-method': 'Method or conditions not stated',
  'unsafe-advice': 'Unsafe advice',
  'spam-or-abuse': 'Spam or abuse',
  other: 'Something else',
} as const;
export type FlagReason = keyof typeof FLAG_REASONS;

/** States of a flag: open until a moderator upholds or dismisses it. */
export const FLAG_STATUSES = ['open', 'upheld', 'dismissed'] as const;
export type FlagStatus = (typeof FLAG_STATUSES)[number];

/** A member's flag on an approved result (by id) or a page (by slug). */
export const flagInputSchema = z
  .object({
    subjectType: z.enum(FLAG_SUBJECTS),
    subject: z.union([z.number().int().positive(), slugSchema]),
    reason: z.enum(Object.keys(FLAG_REASONS) as [FlagReason, ...FlagReason[]]),
    text: z.string().trim().max(1000).optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.reason === 'other' && !v.text) ctx.addIssue({ code: 'custom', path: ['text'], message: 'say what is wrong' });
    if (v.subjectType === 'result' && typeof v.subject !== 'number') ctx.addIssue({ code: 'custom', path: ['subject'], message: 'a result is flagged by its number' });
    if (v.subjectType !== 'result' && typeof v.subject !== 'string') ctx.addIssue({ code: 'custom', path: ['subject'], message: 'a page is flagged by its slug' });
  });
export type FlagInput = z.infer<typeof flagInputSchema>;

/** A moderator closes a flag: upheld (something was done) or dismissed, with a note. */
export const flagResolutionSchema = z
  .object({ outcome: z.enum(['upheld', 'dismissed']), note: z.string().trim().min(1, 'say what was done, or why nothing was').max(limits.noteMax) })
  .strict();
export type FlagResolutionInput = z.infer<typeof flagResolutionSchema>;

/** Pages a member can follow for the weekly digest. */
export const FOLLOWABLE_PAGES = ['steel', 'abrasive'] as const;

/** The path of a follow to remove (`/me/follows/:pageType/:slug`). */
export const followParams = z.object({ pageType: z.enum(FOLLOWABLE_PAGES), slug: slugSchema }).strict();
export type FollowablePage = (typeof FOLLOWABLE_PAGES)[number];
export const followInputSchema = z.object({ pageType: z.enum(FOLLOWABLE_PAGES), slug: slugSchema }).strict();

/** Kinds of e-mail a member can turn off, with their words. */
export const EMAIL_TOPICS = {
  review: 'Decisions on my results',
  application: 'My publisher application',
  digest: 'Weekly digest of pages I follow',
} as const;
export type EmailTopic = keyof typeof EMAIL_TOPICS;
const topicKeys = Object.keys(EMAIL_TOPICS) as [EmailTopic, ...EmailTopic[]];

/** A member's e-mail settings; any subset may be sent. */
export const notificationSettingsSchema = z
  .object({ review: z.boolean().optional(), application: z.boolean().optional(), digest: z.boolean().optional() })
  .strict();

/** The signed unsubscribe link's parameters (no sign-in needed). */
export const unsubscribeSchema = z
  .object({ user: z.coerce.number().int().positive(), topic: z.enum(topicKeys), sig: z.string().regex(/^[A-Za-z0-9_-]{20,100}$/, 'not a valid link') })
  .strict();

/** Filters of the review desk. */
export const reviewDeskQuerySchema = z
  .object({
    /** Only one kind of item; every kind when absent. */
    kind: z.enum(['result', 'page-revision', 'flag']).optional(),
    author: z.string().max(limits.handleMax).optional(),
    steel: slugSchema.optional(),
    importId: z.coerce.number().int().positive().optional(),
  })
  .strict();
export type ReviewDeskQuery = z.infer<typeof reviewDeskQuerySchema>;

/** Approve many pending results at once: listed ids, or every pending result of one import. */
export const bulkApproveSchema = z
  .object({
    ids: z.array(z.number().int().positive()).min(1).max(20_000).optional(),
    importId: z.number().int().positive().optional(),
    note: z.string().trim().max(limits.noteMax).optional(),
  })
  .strict()
  .refine((v) => !!v.ids !== !!v.importId, { message: 'give either ids or importId', path: ['ids'] });

/** The author withdraws an approved result, saying why. */
export const retractInputSchema = z
  .object({ reason: z.string().trim().min(3, 'say why the result is withdrawn').max(limits.noteMax) })
  .strict();

/** Filters of the audit log. */
export const auditQuerySchema = z
  .object({
    actor: z.string().max(limits.handleMax).optional(),
    action: z.string().max(60).optional(),
    page: z.coerce.number().int().min(1).max(100_000).default(1),
  })
  .strict();

/** Site settings an admin can change. */
export const siteSettingsSchema = z
  .object({ trustPublisherImports: z.boolean() })
  .strict();

/** PUT /publishers/settings: any of the settings, nothing else. */
export const siteSettingsChangeSchema = siteSettingsSchema.partial().strict();
export type SiteSettings = z.infer<typeof siteSettingsSchema>;
