import type { FlagReason, FlagSubject } from '@shared/schemas/publishing';

/** An open flag as the desk lists it. */
export interface DeskFlag {
  kind: 'flag';
  id: number;
  subjectType: FlagSubject;
  subjectId: number;
  subject: { title: string; path: string } | null;
  reason: FlagReason;
  reasonLabel: string;
  text: string | null;
  status: 'open' | 'upheld' | 'dismissed';
  createdAt: string;
  reporter: { handle: string } | null;
}

/** A publisher's import that still has results awaiting review. */
export interface DeskImport {
  id: number;
  publisher: { handle: string; displayName: string; role: string } | null;
  rows: number;
  pending: number;
  createdAt: string;
}

/** One audit log line. */
export interface AuditLine {
  id: number;
  at: string;
  actor: { handle: string; role: string } | null;
  action: string;
  outcome: 'done' | 'refused';
  subjectType: string;
  subjectId: number | null;
  reason: string | null;
  details: Record<string, unknown> | null;
}
