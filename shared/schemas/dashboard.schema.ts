import type { AuditEventDto } from './audit.schema';

/** One thing that waits for the signed-in person (a calc to check, a version to confirm…). */
export interface WaitingItem {
  kind: string;
  title: string;
  detail: string;
  link: string;
  since: string;
}

export interface DashboardDto {
  waiting: WaitingItem[];
  counts: { activeProjects: number; activeUsers?: number; inactiveUsers?: number };
  recentActivity: AuditEventDto[] | null;
}
