import type { Action, SubjectName } from '../../../../shared/authz/app-ability';

export interface NavItem {
  path: string;
  label: string;
  icon: string;
  /** Shown only to people who may do this; the server enforces it regardless. */
  needs?: [Action, SubjectName];
  exact?: boolean;
}

export const NAV_ITEMS: NavItem[] = [
  { path: '/', label: 'Overview', icon: 'space_dashboard', exact: true },
  { path: '/projects', label: 'Projects', icon: 'folder_open', needs: ['read', 'Project'] },
  { path: '/rule-sets', label: 'Standards', icon: 'menu_book', needs: ['read', 'RuleSet'] },
  { path: '/audit', label: 'Audit trail', icon: 'fact_check', needs: ['read', 'AuditEvent'] },
  { path: '/review-health', label: 'Review health', icon: 'monitor_heart', needs: ['read', 'ReviewHealth'] },
  { path: '/admin/users', label: 'People and roles', icon: 'group', needs: ['create', 'User'] },
  { path: '/role-confirmations', label: 'Role confirmations', icon: 'how_to_reg', needs: ['read', 'RoleGrant'] },
  { path: '/verify', label: 'Verify a record', icon: 'qr_code_2' },
  { path: '/admin/sent-mail', label: 'Sent mail', icon: 'outgoing_mail', needs: ['read', 'SentMail'] },
];
