/**
 * The product's controlled vocabulary for reference records, with the words shown to people.
 * Values are stable identifiers stored in the database and used in URLs and the API.
 */
export const ABRASIVE_MATERIALS = {
  'aluminium-oxide': 'Aluminium oxide',
  'ceramic-alumina': 'Ceramic alumina',
  'silicon-carbide': 'Silicon carbide',
  cbn: 'CBN',
  diamond: 'Diamond',
  'natural-stone': 'Natural stone',
} as const;
export type AbrasiveMaterial = keyof typeof ABRASIVE_MATERIALS;

export const BONDS = {
  vitrified: 'Vitrified',
  resin: 'Resin',
  electroplated: 'Electroplated',
  metal: 'Metal',
  none: 'None (loose or natural)',
} as const;
export type Bond = keyof typeof BONDS;

export const ABRASIVE_FORMS = {
  wheel: 'Wheel',
  'bench-stone': 'Bench stone',
  belt: 'Belt',
  plate: 'Plate',
  compound: 'Compound',
} as const;
export type AbrasiveForm = keyof typeof ABRASIVE_FORMS;

export const COOLANTS = {
  water: 'Water',
  'water-inhibitor': 'Water with corrosion inhibitor',
  oil: 'Oil',
  dry: 'Dry',
} as const;
export type Coolant = keyof typeof COOLANTS;

export const STEEL_CATEGORIES = {
  carbon: 'Carbon steel',
  'low-alloy': 'Low-alloy steel',
  'tool': 'Tool steel',
  'high-speed': 'High-speed steel',
  stainless: 'Stainless steel',
} as const;
export type SteelCategory = keyof typeof STEEL_CATEGORIES;

export const DESIGNATION_SYSTEMS = ['AISI', 'SAE', 'UNS', 'EN', 'WNr', 'JIS', 'GB', 'ISO'] as const;
export type DesignationSystem = (typeof DESIGNATION_SYSTEMS)[number];

/** Words for a result's states, as shown to people. */
export const STATUS_LABELS = {
  draft: 'Draft',
  pending: 'Awaiting review',
  approved: 'Published',
  returned: 'Changes asked',
  rejected: 'Declined',
  retracted: 'Withdrawn by author',
} as const;

/** A result revision's state, in words. */
export const REVISION_STATUS_LABELS = {
  applied: 'Applied',
  pending: 'Awaiting review',
  approved: 'Published',
  returned: 'Changes asked',
  rejected: 'Declined',
  superseded: 'Replaced by a newer correction',
} as const;

/** Audit-log actions in words (server/commands record them as codes). */
export const AUDIT_ACTION_LABELS: Record<string, string> = {
  'result.approve': 'approved result',
  'result.return': 'returned result to its author',
  'result.reject': 'rejected result',
  'result-revision.approve': 'approved a correction of result',
  'result-revision.return': 'returned a correction of result',
  'result-revision.reject': 'rejected a correction of result',
  'flag.uphold': 'upheld flag',
  'flag.dismiss': 'dismissed flag',
  'publisher-application.approve': 'approved the publisher application',
  'publisher-application.decline': 'declined the publisher application',
  'site-settings.update': 'changed a site setting',
  'user.role': 'changed the role of',
  'user.ban': 'banned',
  'user.unban': 'lifted the ban on',
  'page.create': 'started the page',
};

/**
 * A method page that defines a retention medium is a retention test (cuts counted); the others
 * measure sharpness. One rule for the result form's two lists and the server's check.
 */
export function isRetentionMethod(method: { retentionMedium: string | null }): boolean {
  return !!method.retentionMedium;
}
