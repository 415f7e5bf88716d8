import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ROLE_DUTIES, ROLE_LABELS } from '../../../../shared/authz/roles';
import { SessionStore } from '../../core/auth/session-store';
import { EmptyState } from '../../ui/empty-state';
import { LoadFailure } from '../../ui/load-failure';
import { SafetyNote } from '../../ui/safety-note';
import { AuditActionLabelPipe } from '../../ui/audit-action-label';
import { DashboardApi } from './dashboard-api';
import { WAITING_HINTS } from './waiting-hints';
import { QueueTable } from './queue-table';
import { CalcsApi } from '../calcs/calcs-api';

@Component({
  selector: 'tt-dashboard',
  imports: [
    DatePipe,
    RouterLink,
    MatIconModule,
    MatProgressBarModule,
    EmptyState,
    SafetyNote,
    AuditActionLabelPipe,
    QueueTable,
    LoadFailure,
  ],
  templateUrl: './dashboard.html',
  styleUrl: './dashboard.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class Dashboard {
  private readonly session = inject(SessionStore);
  protected readonly overview = inject(DashboardApi).overview();
  protected readonly queues = inject(CalcsApi).queues();
  protected readonly summary = computed(() => (this.overview.hasValue() ? this.overview.value() : undefined));
  protected readonly queueList = computed(() => (this.queues.hasValue() ? this.queues.value() : undefined));
  protected readonly hasWaiting = computed(() => !!this.summary()?.waiting?.length);

  protected readonly user = this.session.user;
  protected readonly firstName = computed(() => this.user()?.displayName.split(' ')[0] ?? '');
  protected readonly duties = computed(() =>
    (this.user()?.roles ?? []).map((role) => ({
      role,
      label: ROLE_LABELS[role],
      duty: ROLE_DUTIES[role],
      hint: WAITING_HINTS[role],
    })),
  );
}
