import type { Role } from '../../../../shared/authz/roles';

/** What will land in "waiting for you", per role, so an empty list still tells people what to expect. */
export const WAITING_HINTS: Record<Role, string> = {
  author: 'Calcs returned to you with findings, and approvals of your calcs, will be listed here.',
  checker: 'Calcs submitted for independent check by someone else will be listed here.',
  approver: 'Calcs signed as checked and ready for your approval will be listed here.',
  compliance: 'Draft standard versions awaiting a second confirmation, and impact reports, will be listed here.',
  admin: 'Account requests and deactivations to review will be listed here.',
};
