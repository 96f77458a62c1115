import type { CaseKind, CaseStatus } from '../../../shared/api/case-content';

// The lists of shared/api/case-content.ts, restated so the client does not load zod for four words;
// `satisfies` makes the compiler catch a status added there and missing here.
export const CASE_STATUSES = ['draft', 'review', 'released', 'superseded'] as const satisfies readonly CaseStatus[];

export const STATUS_LABELS: Readonly<Record<CaseStatus, string>> = {
  draft: 'Draft',
  review: 'In review',
  released: 'Released',
  superseded: 'Superseded',
};

export interface KindLook {
  readonly label: string;
  readonly icon: string;
  /** Hot in a warm tone, cold in a cool one; always beside the label, never instead of it. */
  readonly colorVar: string;
}

export const KIND_LOOKS: Readonly<Record<CaseKind, KindLook>> = {
  hot: { label: 'Hot', icon: 'whatshot', colorVar: '--ecl-hot' },
  cold: { label: 'Cold', icon: 'ac_unit', colorVar: '--ecl-cold' },
  custom: { label: 'Custom', icon: 'tune', colorVar: '--mat-sys-on-surface-variant' },
};

export const PROPERTY_SET_LABELS: Readonly<Record<'bol' | 'eol', string>> = {
  bol: 'Beginning of life (BOL)',
  eol: 'End of life (EOL)',
};

/** The first 12 hex digits: enough to tell revisions apart at a glance; the page shows all 64. */
export function shortChecksum(checksum: string | null): string {
  return checksum === null ? '—' : checksum.slice(0, 12);
}
