/**
 * The description of every API route, in one list: the OpenAPI document (./document.ts) is built
 * from it and the zod schemas of shared/schemas, which are the same ones the routes validate with.
 *
 * HOW TO DESCRIBE A NEW ROUTE: add one entry to `apiRoutes` below, beside its neighbours: the
 * method and the path exactly as the router registers it (`'/results/:id'`), a summary, who may
 * call it, and the schemas its `route()` validates with (params, query, body), with its response
 * schema (shared/schemas/responses.ts) or kind. tests/api/openapi.test.ts fails, naming the
 * route, while a mounted route has no entry or an entry names no mounted route.
 */
import type { z } from 'zod';
import { emptyQuerySchema, handleParams, idParams } from '@shared/schemas/common';
import { compareCellQuerySchema, compareExportQuerySchema, comparePairedQuerySchema, comparePointsQuerySchema, compareQuerySchema } from '@shared/schemas/compare';
import { importQuerySchema } from '@shared/schemas/import';
import {
  abrasiveListQuerySchema,
  PAGE_SECTIONS,
  PAGE_TYPES,
  pageCreateSchemas,
  pageEditSchemas,
  pageMergeSchema,
  pageProtectSchema,
  pageReviewSchema,
  pageRevertSchema,
  revisionParams,
  slugParams,
  steelListQuerySchema,
} from '@shared/schemas/pages';
import {
  applicationDecisionSchema,
  applicationListQuerySchema,
  auditQuerySchema,
  bulkApproveSchema,
  flagInputSchema,
  flagResolutionSchema,
  followInputSchema,
  followParams,
  notificationSettingsSchema,
  photoFieldsSchema,
  publisherApplicationSchema,
  retractInputSchema,
  reviewDeskQuerySchema,
  siteSettingsChangeSchema,
  tokenCreateSchema,
  unsubscribeSchema,
} from '@shared/schemas/publishing';
import { resultInputSchema, resultListQuerySchema, resultRevisionParams, reviewInputSchema, searchQuerySchema } from '@shared/schemas/result';
import { adminUserChangeSchema, adminUsersQuerySchema, handleParamsSchema } from '@shared/schemas/admin';
import {
  applicationListSchema,
  applicationSchema,
  auditPageSchema,
  bulkApprovalSchema,
  caughtMailSchema,
  createdTokenSchema,
  doneSchema,
  edgeAngleAnswerSchema,
  flagListSchema,
  flagSchema,
  gritToolAnswerSchema,
  hardnessToolAnswerSchema,
  managedAccountChangeSchema,
  priceSummarySchema,
  publisherListSchema,
  retentionToolAnswerSchema,
  reviewDeskSchema,
  siteSettingsAnswerSchema,
  tokenListSchema,
  wearDriftAnswerSchema,
  compareCellSchema,
  compareDifferenceSchema,
  comparePairedSchema,
  comparePointsSchema,
  compareTableSchema,
  deskContextSchema,
  importedSchema,
  importRefusedSchema,
  importReportSchema,
  pageConflictSchema,
  profileSchema,
  searchAnswerSchema,
  duplicatesSchema,
  followSchema,
  notificationSettingsAnswerSchema,
  photoListSchema,
  photoSchema,
  unsubscribedSchema,
  createdIdSchema,
  healthSchema,
  jsonObjectSchema,
  loggedWheelSchema,
  managedAccountPageSchema,
  ownPageSchema,
  pageHistorySchema,
  pageListSchema,
  pageReviewOutcomeSchema,
  pageRevisionSchema,
  pageCreatedSchema,
  pageSaveSchema,
  resultEditSchema,
  resultInputExample,
  resultPageSchema,
  resultRevisionDecisionSchema,
  resultRevisionListSchema,
  resultSchema,
  sessionSchema,
  wheelListSchema,
  wikiPageSchema,
  workshopSchema,
} from '@shared/schemas/responses';
import { angleToolQuerySchema, gritToolQuerySchema, hardnessToolQuerySchema, retentionToolBodySchema, sideAngleToolQuerySchema, wearDriftQuerySchema } from '@shared/schemas/tools';
import { measurementParams, wheelInputSchema, wheelMeasurementSchema } from '@shared/schemas/wheels';
import {
  grinderInputSchema,
  jigInputSchema,
  priceReportInputSchema,
  priceReportQuerySchema,
  retireWheelSchema,
  setupInputSchema,
  workshopWheelInputSchema,
} from '@shared/schemas/workshop';

/**
 * Who may call a route: anyone; any signed-in account (session cookie or API token); or an
 * account of at least that role.
 */
export type Access = 'public' | 'signed-in' | 'publisher' | 'moderator' | 'admin';

/** What a route answers on success. */
export type Answer =
  | {
      json: z.ZodType;
      status?: 200 | 201 | 202;
      paged?: true;
      /** A second success status: 202 with the same body (proposed for review, not applied), or another status with its own body. */
      also?: 202 | { status: 200; json: z.ZodType; description: string };
    }
  | { file: 'text/csv' | 'image/jpeg' | 'application/json'; status?: 200 }
  | { empty: 204 };

export interface RouteDoc {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  /** The path under /api/v1 as the router registers it, with `:name` parameters. */
  path: string;
  summary: string;
  /** Groups routes in the reference page. */
  tag: string;
  access: Access;
  params?: z.ZodType;
  query?: z.ZodType;
  body?: z.ZodType;
  /** A multipart/form-data upload: the file's field name and the other fields' schema. */
  upload?: { field: string; fields?: z.ZodType };
  /** An example request body (invented values). */
  example?: unknown;
  answer: Answer;
  /** Refusals beyond those its access, params and inputs imply (409 conflict, 413 too large…). */
  errors?: number[];
  /** Refusals whose body carries more than the error (a 409's current revision…): the document accepts either. */
  refusals?: Partial<Record<400 | 409, z.ZodType>>;
  description?: string;
}

const json = (schema: z.ZodType = jsonObjectSchema, status?: 200 | 201 | 202) => ({ json: schema, ...(status ? { status } : {}) });
const created = (schema: z.ZodType = jsonObjectSchema) => json(schema, 201);
const noContent = { empty: 204 } as const;
const csv = { file: 'text/csv' } as const;

/** The routes of each reference-page section (steels, abrasives, methods): the same for all three. */
const pageRoutes: RouteDoc[] = PAGE_TYPES.flatMap((type): RouteDoc[] => {
  const section = PAGE_SECTIONS[type];
  const tag = 'reference pages';
  return [
    {
      method: 'post',
      path: `/${section}`,
      summary: `Start a ${type} page (201, its first revision live; 409 when the slug is taken)`,
      tag,
      access: 'moderator',
      body: pageCreateSchemas[type],
      answer: json(pageCreatedSchema, 201),
      errors: [409],
    },
    { method: 'get', path: `/${section}/:slug`, summary: `One ${type} page (301 to the surviving page when it was merged)`, tag, access: 'public', params: slugParams, answer: json(wikiPageSchema) },
    {
      method: 'put',
      path: `/${section}/:slug`,
      summary: `Edit a ${type} page (202 when the edit is proposed for review; 409 when someone saved first)`,
      tag,
      access: 'signed-in',
      params: slugParams,
      body: pageEditSchemas[type],
      answer: { json: pageSaveSchema, also: 202 },
      errors: [409],
      refusals: { 409: pageConflictSchema },
    },
    { method: 'get', path: `/${section}/:slug/revisions`, summary: `The history of a ${type} page: its revisions, numbered 1, 2, 3… on the page`, tag, access: 'public', params: slugParams, answer: json(pageHistorySchema) },
    { method: 'get', path: `/${section}/:slug/revisions/:id`, summary: `One revision of a ${type} page, by its id (its answer gives its number on the page)`, tag, access: 'public', params: revisionParams, answer: json(pageRevisionSchema) },
    { method: 'post', path: `/${section}/:slug/revert`, summary: `Revert a ${type} page to an earlier revision (named by its id)`, tag, access: 'moderator', params: slugParams, body: pageRevertSchema, answer: json(pageSaveSchema), errors: [409] },
    { method: 'post', path: `/${section}/:slug/protect`, summary: `Protect a ${type} page or lift its protection`, tag, access: 'moderator', params: slugParams, body: pageProtectSchema, answer: json() },
    { method: 'post', path: `/${section}/:slug/merge`, summary: `Merge a duplicate ${type} page into this one`, tag, access: 'moderator', params: slugParams, body: pageMergeSchema, answer: json(), errors: [409] },
  ];
});

/** Every route of the API under /api/v1 (and its alias /api). */
export const apiRoutes: RouteDoc[] = [
  // The service
  { method: 'get', path: '/health', summary: 'Whether the server answers, with its search index size and queued writes', tag: 'service', access: 'public', query: emptyQuerySchema, answer: json(healthSchema) },
  { method: 'get', path: '/session', summary: 'Who is signed in, and the CSRF token that writes with the session cookie send', tag: 'service', access: 'public', query: emptyQuerySchema, answer: json(sessionSchema) },
  { method: 'get', path: '/openapi.json', summary: 'This document', tag: 'service', access: 'public', query: emptyQuerySchema, answer: json() },
  { method: 'get', path: '/search', summary: 'Search pages, results and comparison cells', tag: 'service', access: 'public', query: searchQuerySchema, answer: json(searchAnswerSchema), errors: [429] },

  // The comparison
  { method: 'get', path: '/compare', summary: 'One page of the comparison’s cells for one method version, sorted', tag: 'comparison', access: 'public', query: compareQuerySchema, answer: { json: compareTableSchema, paged: true } },
  { method: 'get', path: '/compare/export', summary: 'The whole comparison view as CSV or JSON, with licence and citation', tag: 'comparison', access: 'public', query: compareExportQuerySchema, answer: csv },
  { method: 'get', path: '/compare/cell', summary: 'One cell’s figures and a page of its results', tag: 'comparison', access: 'public', query: compareCellQuerySchema, answer: { json: compareCellSchema, paged: true } },
  { method: 'get', path: '/compare/paired', summary: 'Tester-paired differences between two cells', tag: 'comparison', access: 'public', query: comparePairedQuerySchema, answer: json(comparePairedSchema) },
  { method: 'get', path: '/compare/difference', summary: 'Two cells as independent samples: the shift B − A with its 95 % interval, and the within-edge spread', tag: 'comparison', access: 'public', query: comparePairedQuerySchema, answer: json(compareDifferenceSchema) },
  { method: 'get', path: '/compare/points', summary: 'The comparison’s chart points', tag: 'comparison', access: 'public', query: comparePointsQuerySchema, answer: json(comparePointsSchema) },

  // Reference pages
  { method: 'get', path: '/steels', summary: 'Steel pages, filtered', tag: 'reference pages', access: 'public', query: steelListQuerySchema, answer: json(pageListSchema) },
  { method: 'get', path: '/abrasives', summary: 'Abrasive pages, filtered', tag: 'reference pages', access: 'public', query: abrasiveListQuerySchema, answer: json(pageListSchema) },
  { method: 'get', path: '/methods', summary: 'Test method pages', tag: 'reference pages', access: 'public', query: emptyQuerySchema, answer: json(pageListSchema) },
  ...pageRoutes,
  { method: 'post', path: '/page-revisions/:id/review', summary: 'Accept or decline a proposed page revision', tag: 'reference pages', access: 'moderator', params: idParams, body: pageReviewSchema, answer: json(pageReviewOutcomeSchema), errors: [409], refusals: { 409: pageConflictSchema } },
  { method: 'get', path: '/page-revisions/:id', summary: 'One page revision by id', tag: 'reference pages', access: 'public', params: idParams, answer: json(pageRevisionSchema) },

  // Results
  { method: 'post', path: '/results', summary: 'Submit a result', tag: 'results', access: 'signed-in', body: resultInputSchema, example: resultInputExample, answer: created(resultSchema) },
  { method: 'post', path: '/results/drafts', summary: 'Save a result as a draft (not on the review desk)', tag: 'results', access: 'signed-in', body: resultInputSchema, example: resultInputExample, answer: created(resultSchema) },
  ...(
    [
      ['/results/:id', 'Edit one of your results: applied at once before publication (200), a correction waiting for a moderator after it (202)'],
      ['/results/:id/draft', 'Edit one of your results and keep it a draft (202 for a published result, as above)'],
    ] as const
  ).map(
    ([path, summary]): RouteDoc => ({
      method: 'put',
      path,
      summary,
      tag: 'results',
      access: 'signed-in',
      params: idParams,
      body: resultInputSchema,
      example: resultInputExample,
      answer: { json: resultEditSchema, also: 202 },
      errors: [409],
    }),
  ),
  { method: 'get', path: '/results/:id/revisions', summary: 'A result’s versions the viewer may see, with the changes of each', tag: 'results', access: 'public', params: idParams, query: emptyQuerySchema, answer: json(resultRevisionListSchema) },
  {
    method: 'post',
    path: '/results/:id/revisions/:rev/review',
    summary: 'Approve, return or reject a pending correction of a published result',
    tag: 'results',
    access: 'moderator',
    params: resultRevisionParams,
    body: reviewInputSchema,
    answer: json(resultRevisionDecisionSchema),
    errors: [409],
  },
  { method: 'get', path: '/results', summary: 'Results, newest first, one page at a time', tag: 'results', access: 'public', query: resultListQuerySchema, answer: { json: resultPageSchema, paged: true } },
  { method: 'get', path: '/results/:id', summary: 'One result', tag: 'results', access: 'public', params: idParams, answer: json(resultSchema) },
  { method: 'post', path: '/results/:id/review', summary: 'Approve, return or reject a pending result', tag: 'results', access: 'moderator', params: idParams, body: reviewInputSchema, answer: json(resultSchema), errors: [409] },
  { method: 'post', path: '/results/:id/retract', summary: 'Retract one of your results', tag: 'results', access: 'signed-in', params: idParams, body: retractInputSchema, answer: json(resultSchema), errors: [409] },
  { method: 'get', path: '/review-desk', summary: 'The moderators’ queue: pending results, proposed revisions, open flags, imports', tag: 'results', access: 'moderator', query: reviewDeskQuerySchema, answer: json(reviewDeskSchema) },
  { method: 'get', path: '/review-desk/results/:id/context', summary: 'A pending result’s context on the desk: its cell, the outlier hint, readings, near-duplicates, the author’s record', tag: 'results', access: 'moderator', params: idParams, query: emptyQuerySchema, answer: json(deskContextSchema), errors: [409] },
  { method: 'post', path: '/review-desk/bulk-approve', summary: 'Approve several pending results at once', tag: 'results', access: 'moderator', body: bulkApproveSchema, answer: json(bulkApprovalSchema) },
  {
    method: 'post',
    path: '/results/:id/photos',
    summary: 'Add a photo to one of your results (re-encoded, metadata removed)',
    tag: 'results',
    access: 'signed-in',
    params: idParams,
    upload: { field: 'photo', fields: photoFieldsSchema },
    answer: created(photoSchema),
    errors: [413, 415],
  },
  { method: 'get', path: '/results/:id/photos', summary: 'A result’s photos', tag: 'results', access: 'public', params: idParams, answer: json(photoListSchema) },
  { method: 'get', path: '/photos/:id', summary: 'A photo (JPEG)', tag: 'results', access: 'public', params: idParams, answer: { file: 'image/jpeg' } },
  { method: 'get', path: '/photos/:id/thumb', summary: 'A photo’s thumbnail (JPEG)', tag: 'results', access: 'public', params: idParams, answer: { file: 'image/jpeg' } },
  { method: 'delete', path: '/photos/:id', summary: 'Remove a photo (its result’s author or a moderator)', tag: 'results', access: 'signed-in', params: idParams, answer: noContent },
  { method: 'get', path: '/import/template.csv', summary: 'The bulk import file’s template', tag: 'results', access: 'public', query: emptyQuerySchema, answer: csv },
  {
    method: 'post',
    path: '/import/results',
    summary: 'Import results from a CSV file (dryRun=1 checks it and stores nothing)',
    tag: 'results',
    access: 'publisher',
    query: importQuerySchema,
    upload: { field: 'file' },
    answer: { ...created(importedSchema), also: { status: 200, json: importReportSchema, description: 'The dry run’s report: nothing stored' } },
    errors: [413, 415],
    refusals: { 400: importRefusedSchema },
  },

  // Tools
  { method: 'get', path: '/tools/grit', summary: 'Translate a grit grade between standards (particle size in µm)', tag: 'tools', access: 'public', query: gritToolQuerySchema, answer: json(gritToolAnswerSchema) },
  { method: 'get', path: '/tools/hardness', summary: 'Convert a hardness between scales', tag: 'tools', access: 'public', query: hardnessToolQuerySchema, answer: json(hardnessToolAnswerSchema) },
  { method: 'get', path: '/tools/angle', summary: 'The edge angle from a wheel setup', tag: 'tools', access: 'public', query: angleToolQuerySchema, answer: json(edgeAngleAnswerSchema) },
  { method: 'get', path: '/tools/side-angle', summary: 'The edge angle from a side-grinding setup, or the gap for an angle', tag: 'tools', access: 'public', query: sideAngleToolQuerySchema, answer: json(edgeAngleAnswerSchema) },
  { method: 'get', path: '/tools/wear-drift', summary: 'How the angle drifts as a wheel wears', tag: 'tools', access: 'public', query: wearDriftQuerySchema, answer: json(wearDriftAnswerSchema) },
  { method: 'post', path: '/tools/retention', summary: 'Edge-retention figures from counts', tag: 'tools', access: 'public', body: retentionToolBodySchema, answer: json(retentionToolAnswerSchema) },
  { method: 'get', path: '/wheels', summary: 'Your logged wheels', tag: 'tools', access: 'signed-in', query: emptyQuerySchema, answer: json(wheelListSchema) },
  { method: 'post', path: '/wheels', summary: 'Log a wheel', tag: 'tools', access: 'signed-in', body: wheelInputSchema, answer: created(loggedWheelSchema) },
  { method: 'post', path: '/wheels/:id/measurements', summary: 'Log a wheel’s measured diameter', tag: 'tools', access: 'signed-in', params: idParams, body: wheelMeasurementSchema, answer: created(loggedWheelSchema) },
  { method: 'patch', path: '/wheels/:id/measurements/:measurementId', summary: 'Correct one measurement of your wheel', tag: 'tools', access: 'signed-in', params: measurementParams, body: wheelMeasurementSchema, answer: noContent },
  { method: 'delete', path: '/wheels/:id/measurements/:measurementId', summary: 'Remove one measurement of your wheel', tag: 'tools', access: 'signed-in', params: measurementParams, answer: noContent },

  // The workshop (private to its owner) and price reports
  { method: 'get', path: '/workshop', summary: 'Your workshop: grinders, jigs, setups with today’s settings, wheels with forecasts and costs, the kit', tag: 'workshop', access: 'signed-in', query: emptyQuerySchema, answer: json(workshopSchema) },
  { method: 'post', path: '/workshop/grinders', summary: 'Add a grinder', tag: 'workshop', access: 'signed-in', body: grinderInputSchema, answer: created(createdIdSchema) },
  { method: 'post', path: '/workshop/jigs', summary: 'Add a jig', tag: 'workshop', access: 'signed-in', body: jigInputSchema, answer: created(createdIdSchema) },
  { method: 'post', path: '/workshop/setups', summary: 'Save a setup (projection and angle, with a jig or none)', tag: 'workshop', access: 'signed-in', body: setupInputSchema, answer: created(createdIdSchema) },
  { method: 'post', path: '/workshop/wheels', summary: 'Add a wheel to a grinder', tag: 'workshop', access: 'signed-in', body: workshopWheelInputSchema, answer: created(createdIdSchema) },
  { method: 'post', path: '/workshop/wheels/:id/retire', summary: 'Retire a wheel, with the sharpenings it lasted', tag: 'workshop', access: 'signed-in', params: idParams, body: retireWheelSchema, answer: noContent },
  { method: 'get', path: '/price-reports', summary: 'Reported prices of one abrasive: medians with n per currency and condition, no reporter named', tag: 'workshop', access: 'public', query: priceReportQuerySchema, answer: json(priceSummarySchema), errors: [404] },
  { method: 'post', path: '/price-reports', summary: 'Report a price you paid for an abrasive', tag: 'workshop', access: 'signed-in', body: priceReportInputSchema, answer: created(doneSchema) },

  // Members
  { method: 'get', path: '/me', summary: 'Your own page: account, counts, drafts, follows, settings', tag: 'members', access: 'signed-in', query: emptyQuerySchema, answer: json(ownPageSchema) },
  { method: 'get', path: '/me/results.csv', summary: 'All your results as CSV', tag: 'members', access: 'signed-in', query: emptyQuerySchema, answer: csv },
  { method: 'put', path: '/me/notifications', summary: 'Which e-mails you receive', tag: 'members', access: 'signed-in', body: notificationSettingsSchema, answer: json(notificationSettingsAnswerSchema) },
  { method: 'post', path: '/me/follows', summary: 'Follow a page', tag: 'members', access: 'signed-in', body: followInputSchema, answer: created(followSchema) },
  { method: 'delete', path: '/me/follows/:pageType/:slug', summary: 'Stop following a page', tag: 'members', access: 'signed-in', params: followParams, answer: noContent },
  { method: 'post', path: '/me/duplicate-check', summary: 'Your results that a new one would repeat', tag: 'members', access: 'signed-in', body: resultInputSchema, example: resultInputExample, answer: json(duplicatesSchema) },
  { method: 'post', path: '/me/unsubscribe', summary: 'Unsubscribe from one kind of e-mail by the signed link it carried', tag: 'members', access: 'public', body: unsubscribeSchema, answer: json(unsubscribedSchema) },
  { method: 'get', path: '/profiles/:handle', summary: 'A member’s public profile', tag: 'members', access: 'public', params: handleParams, answer: json(profileSchema) },
  { method: 'get', path: '/profiles/:handle/results.csv', summary: 'A member’s published results as CSV', tag: 'members', access: 'public', params: handleParams, answer: csv },
  { method: 'get', path: '/tokens', summary: 'Your API tokens', tag: 'members', access: 'publisher', query: emptyQuerySchema, answer: json(tokenListSchema) },
  {
    method: 'post',
    path: '/tokens',
    summary: 'Make an API token (its secret is shown once)',
    tag: 'members',
    access: 'publisher',
    body: tokenCreateSchema,
    example: { name: 'nightly upload script' },
    answer: created(createdTokenSchema),
  },
  { method: 'delete', path: '/tokens/:id', summary: 'Revoke one of your API tokens', tag: 'members', access: 'publisher', params: idParams, answer: noContent },

  // Publishing and curation
  { method: 'get', path: '/publishers', summary: 'The publishers', tag: 'curation', access: 'public', query: emptyQuerySchema, answer: json(publisherListSchema) },
  { method: 'post', path: '/publishers/applications', summary: 'Apply to become a publisher', tag: 'curation', access: 'signed-in', body: publisherApplicationSchema, answer: created(applicationSchema), errors: [409] },
  { method: 'get', path: '/publishers/applications', summary: 'Publisher applications', tag: 'curation', access: 'admin', query: applicationListQuerySchema, answer: json(applicationListSchema) },
  { method: 'post', path: '/publishers/applications/:id/decision', summary: 'Accept or decline an application', tag: 'curation', access: 'admin', params: idParams, body: applicationDecisionSchema, answer: json(applicationSchema), errors: [409] },
  { method: 'get', path: '/publishers/settings', summary: 'The site’s publishing settings', tag: 'curation', access: 'admin', query: emptyQuerySchema, answer: json(siteSettingsAnswerSchema) },
  { method: 'put', path: '/publishers/settings', summary: 'Change the site’s publishing settings', tag: 'curation', access: 'admin', body: siteSettingsChangeSchema, answer: json(siteSettingsAnswerSchema) },
  { method: 'post', path: '/flags', summary: 'Flag a result or page for the moderators', tag: 'curation', access: 'signed-in', body: flagInputSchema, answer: created(flagSchema), errors: [409] },
  { method: 'get', path: '/flags', summary: 'Open flags', tag: 'curation', access: 'moderator', query: emptyQuerySchema, answer: json(flagListSchema) },
  { method: 'post', path: '/flags/:id/resolve', summary: 'Resolve a flag', tag: 'curation', access: 'moderator', params: idParams, body: flagResolutionSchema, answer: json(flagSchema), errors: [409] },
  { method: 'get', path: '/audit', summary: 'The audit log, newest first, one page at a time', tag: 'curation', access: 'moderator', query: auditQuerySchema, answer: { json: auditPageSchema, paged: true } },

  { method: 'get', path: '/admin/users', summary: 'Accounts whose handle or name contains q, with their result counts, one page at a time', tag: 'curation', access: 'admin', query: adminUsersQuerySchema, answer: { json: managedAccountPageSchema, paged: true } },
  { method: 'patch', path: '/admin/users/:handle', summary: 'Change an account’s role, ban it or lift its ban, with the reason (audited)', tag: 'curation', access: 'admin', params: handleParamsSchema, body: adminUserChangeSchema, answer: json(managedAccountChangeSchema), errors: [409] },

  { method: 'get', path: '/dev/mail', summary: 'Mail caught by the local mail catcher (where it runs: never in production)', tag: 'service', access: 'admin', query: emptyQuerySchema, answer: json(caughtMailSchema) },
];
