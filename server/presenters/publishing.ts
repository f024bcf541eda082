import { FLAG_REASONS } from '@shared/schemas/publishing';
import type { ApiToken, AuditEntry, Flag, Photo, PublisherApplication } from '../models';
import { applicationSchema, auditEntrySchema, flagSchema, photoSchema, tokenSchema, type Presented } from '@shared/schemas/responses';
import { presentAccount } from './user';

/** A publisher application as its applicant and admins see it (never an e-mail address). */
export function presentApplication(a: PublisherApplication): Presented<typeof applicationSchema> {
  return {
    id: a.id,
    status: a.status,
    workshop: a.workshop,
    instruments: a.instruments,
    link: a.link,
    createdAt: a.createdAt,
    applicant: a.applicant ? presentAccount(a.applicant) : null,
    decision: a.decidedAt ? { at: a.decidedAt, note: a.decisionNote, by: a.decidedBy ? { handle: a.decidedBy.handle } : null } : null,
  };
}

/** A token as listed to its owner: never the token or its hash, only the prefix to tell it apart. */
export function presentToken(t: ApiToken): Presented<typeof tokenSchema> {
  return { id: t.id, name: t.name, prefix: t.prefix, createdAt: t.createdAt, lastUsedAt: t.lastUsedAt, revokedAt: t.revokedAt, active: !t.revokedAt };
}

/** The addresses a photo is served at. */
export function photoUrls(photo: Pick<Photo, 'id'>) {
  return { url: `/api/v1/photos/${photo.id}`, thumbUrl: `/api/v1/photos/${photo.id}/thumb` };
}

/** A photo of a result: its addresses, alt text and stored size (never its storage keys). */
export function presentPhoto(p: Photo): Presented<typeof photoSchema> {
  return { id: p.id, resultId: p.resultId, ...photoUrls(p), alt: p.alt, width: p.width, height: p.height, bytes: p.bytes, createdAt: p.createdAt };
}

/** A flag as moderators see it on the desk; `subject` is filled by the caller (a title and a link). */
export function presentFlag(f: Flag, subject: { title: string; path: string } | null): Presented<typeof flagSchema> {
  return {
    id: f.id,
    subjectType: f.subjectType,
    subjectId: f.subjectId,
    subject,
    reason: f.reason,
    reasonLabel: FLAG_REASONS[f.reason] ?? f.reason,
    text: f.text,
    status: f.status,
    createdAt: f.createdAt,
    reporter: f.reporter ? { handle: f.reporter.handle } : null,
    resolution: f.resolvedAt ? { at: f.resolvedAt, note: f.resolutionNote } : null,
  };
}

/** One audit log line: who, what, on what, when, why, and whether it was done or refused. */
export function presentAuditEntry(e: AuditEntry): Presented<typeof auditEntrySchema> {
  return {
    id: e.id,
    at: e.createdAt,
    actor: e.actor ? { handle: e.actor.handle, role: e.actor.role } : null,
    action: e.action,
    outcome: e.outcome,
    subjectType: e.subjectType,
    subjectId: e.subjectId,
    reason: e.reason,
    details: e.details,
  };
}
