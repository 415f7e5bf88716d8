/** The roles of a design office. A person may hold several; separation of duties applies per calc. */
export const ROLES = ['author', 'checker', 'approver', 'compliance', 'admin'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  author: 'Author',
  checker: 'Checker',
  approver: 'Approver',
  compliance: 'Compliance',
  admin: 'Administrator',
};

export const ROLE_DUTIES: Record<Role, string> = {
  author: 'Builds shaft calcs, runs the checks, answers findings, submits for check',
  checker: 'Reviews calcs independently, raises findings, returns or signs as checked',
  approver: 'Reviews checked calcs and signs them as approved for release',
  compliance: 'Owns the design standards and their versions; audits the record',
  admin: 'Manages user accounts, roles and projects',
};

/**
 * Roles that put a signature on a calc. Giving one takes a second person's confirmation, so
 * no single administrator can make someone (or themselves, through a second account) a signer.
 */
export const SIGNING_ROLES: readonly Role[] = ['author', 'checker', 'approver'];
