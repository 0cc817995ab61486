/**
 * What a client-facing document says about the acceptance checks: the standard they come from and the version of
 * the criteria Rillmark applies. How far each threshold was confirmed is recorded in savings-verdict.ts and
 * docs/references.md §6, and tested there; it is not printed for clients.
 */
export const ACCEPTANCE_CRITERIA = {
  standard: 'ASHRAE Guideline 14-2002',
  clause: '§5.2.11 (whole-building regression baseline)',
  /** Bump when a threshold or a check changes, so an old handout can be matched to the rules it applied. */
  version: 'Rillmark savings criteria, version 1 (December 2026)',
} as const;

/** "ASHRAE Guideline 14-2002 §5.2.11 (whole-building regression baseline); Rillmark savings criteria, version 1 …" */
export function criteriaCitation(): string {
  return `${ACCEPTANCE_CRITERIA.standard} ${ACCEPTANCE_CRITERIA.clause}; ${ACCEPTANCE_CRITERIA.version}`;
}
