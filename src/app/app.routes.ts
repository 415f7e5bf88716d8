import { Routes } from '@angular/router';
import { abilityGuard, anonymousGuard, signedInGuard } from './core/auth/auth-guard';
import { PREFETCH } from './core/http/route-prefetch';
import { calcPageReads, editorReads, overviewReads } from './route-reads';

export const routes: Routes = [
  {
    path: 'sign-in',
    canActivate: [anonymousGuard],
    title: 'Sign in · Torquetrail',
    loadComponent: () => import('./features/sign-in/sign-in'),
  },
  {
    path: '',
    canActivate: [signedInGuard],
    loadComponent: () => import('./core/shell/shell'),
    children: [
      {
        path: '',
        pathMatch: 'full',
        title: 'Overview · Torquetrail',
        data: { [PREFETCH]: overviewReads },
        loadComponent: () => import('./features/dashboard/dashboard'),
      },
      {
        path: 'projects',
        title: 'Projects · Torquetrail',
        canActivate: [abilityGuard('read', 'Project')],
        loadComponent: () => import('./features/projects/projects-page'),
      },
      {
        path: 'projects/:id',
        title: 'Project · Torquetrail',
        canActivate: [abilityGuard('read', 'Project')],
        loadComponent: () => import('./features/calcs/project-calcs/project-calcs'),
      },
      {
        path: 'calcs/:id',
        title: 'Calc · Torquetrail',
        data: { [PREFETCH]: calcPageReads },
        canActivate: [abilityGuard('read', 'Calc')],
        loadComponent: () => import('./features/calcs/calc-page/calc-page'),
      },
      {
        path: 'rule-sets',
        title: 'Standards · Torquetrail',
        canActivate: [abilityGuard('read', 'RuleSet')],
        loadComponent: () => import('./features/rule-sets/rule-set-library'),
      },
      {
        path: 'rule-sets/compare',
        title: 'Compare standards · Torquetrail',
        canActivate: [abilityGuard('read', 'RuleSet')],
        loadComponent: () => import('./features/rule-sets/rule-set-compare'),
      },
      {
        path: 'rule-sets/:id',
        title: 'Standard · Torquetrail',
        canActivate: [abilityGuard('read', 'RuleSet')],
        loadComponent: () => import('./features/rule-sets/rule-set-view'),
      },
      {
        path: 'revisions/:id/edit',
        title: 'Calc editor · Torquetrail',
        data: { [PREFETCH]: editorReads },
        canDeactivate: [(page: { confirmLeave(): boolean | Promise<boolean> }) => page.confirmLeave()],
        loadComponent: () => import('./features/calcs/editor/revision-editor'),
      },
      {
        path: 'revisions/:id/independent-model',
        title: 'Independent model · Torquetrail',
        canActivate: [abilityGuard('read', 'Revision')],
        canDeactivate: [(page: { confirmLeave(): boolean }) => page.confirmLeave()],
        loadComponent: () => import('./features/calcs/independent/model-editor'),
      },
      {
        path: 'audit',
        title: 'Audit trail · Torquetrail',
        canActivate: [abilityGuard('read', 'AuditEvent')],
        loadComponent: () => import('./features/audit/audit-page'),
      },
      {
        path: 'review-health',
        title: 'Review health · Torquetrail',
        canActivate: [abilityGuard('read', 'ReviewHealth')],
        loadComponent: () => import('./features/review-health/review-health-page'),
      },
      {
        path: 'admin/users',
        title: 'People and roles · Torquetrail',
        canActivate: [abilityGuard('create', 'User')],
        loadComponent: () => import('./features/admin/users/users-page'),
      },
      {
        path: 'role-confirmations',
        title: 'Role confirmations · Torquetrail',
        canActivate: [abilityGuard('read', 'RoleGrant')],
        loadComponent: () => import('./features/admin/users/role-grants-page'),
      },
      {
        path: 'verify',
        title: 'Verify a record · Torquetrail',
        loadComponent: () => import('./features/records/verify-page'),
      },
      {
        path: 'verify/:hash',
        title: 'Verify a record · Torquetrail',
        loadComponent: () => import('./features/records/verify-page'),
      },
      {
        path: 'admin/sent-mail',
        title: 'Sent mail · Torquetrail',
        canActivate: [abilityGuard('read', 'SentMail')],
        loadComponent: () => import('./features/records/sent-mail-page'),
      },
      {
        path: 'account',
        title: 'Your account · Torquetrail',
        loadComponent: () => import('./features/account/account-page'),
      },
    ],
  },
  { path: '**', redirectTo: '' },
];
