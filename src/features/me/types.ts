import type { ResultStatus } from '@shared/schemas/result';
import type { EmailTopic } from '@shared/schemas/publishing';
import type { Result, SessionUser } from '@/types/api';

/** A publisher's badge: the workshop or lab of their approved application. */
export interface PublisherBadge {
  label: string;
  workshop: string | null;
  link: string | null;
}

/** An API token as listed (never the token itself). */
export interface ApiTokenInfo {
  id: number;
  name: string;
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
  active: boolean;
}

/** A publisher application as its applicant sees it. */
export interface PublisherApplicationInfo {
  id: number;
  status: 'pending' | 'approved' | 'declined';
  workshop: string;
  instruments: string;
  link: string;
  createdAt: string;
  applicant: SessionUser | null;
  decision: { at: string; note: string | null; by: { handle: string } | null } | null;
}

/** GET /api/me: the member's own page. */
export interface OwnPage {
  account: SessionUser & { hasEmail: boolean; badge: PublisherBadge | null };
  counts: Partial<Record<ResultStatus, number>>;
  drafts: Result[];
  pending: Result[];
  returned: Result[];
  rejected: Result[];
  following: { pageType: 'steel' | 'abrasive'; slug: string; name: string }[];
  notifications: Record<EmailTopic, boolean>;
  tokens: ApiTokenInfo[];
  application: PublisherApplicationInfo | null;
  imports: { id: number; rows: number; createdAt: string; pending: number }[];
  can: { import: boolean; tokens: boolean; apply: boolean };
}
