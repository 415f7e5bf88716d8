import { ChangeDetectionStrategy, Component, computed, inject, type Signal, viewChild } from '@angular/core';
import { DatePipe } from '@angular/common';
import { MatTableModule } from '@angular/material/table';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatDialog } from '@angular/material/dialog';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTooltipModule } from '@angular/material/tooltip';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RoleLabelPipe } from '../../../ui/role-label';
import type { UserDto } from '../../../../../shared/schemas/user.schema';
import { SessionStore } from '../../../core/auth/session-store';
import { assertApiFailure } from '../../../core/http/api-failure';
import { EmptyState } from '../../../ui/empty-state';
import { LoadFailure } from '../../../ui/load-failure';
import { pagedFilters } from '../../../ui/list-filters';
import { UsersApi, type UserListParams } from './users-api';
import { UserDialog } from './user-dialog';
import { PendingGrants } from './pending-grants';

@Component({
  selector: 'tt-users-page',
  imports: [
    DatePipe,
    MatTableModule,
    MatPaginatorModule,
    MatButtonModule,
    MatIconModule,
    MatFormFieldModule,
    MatInputModule,
    MatTooltipModule,
    MatProgressBarModule,
    EmptyState,
    LoadFailure,
    RoleLabelPipe,
    PendingGrants,
  ],
  templateUrl: './users-page.html',
  styleUrl: './users-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class UsersPage {
  private readonly api = inject(UsersApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly me = inject(SessionStore).user;

  private readonly list = pagedFilters<Pick<UserListParams, 'q'>>({ q: '' });
  protected readonly params: Signal<UserListParams> = this.list.params;
  protected readonly users = this.api.list(this.params);
  protected readonly rows = computed(() => (this.users.hasValue() ? this.users.value().items : []));
  protected readonly total = computed(() => (this.users.hasValue() ? this.users.value().total : 0));
  private readonly pendingGrants = viewChild.required(PendingGrants);
  protected readonly columns = ['username', 'displayName', 'roles', 'status', 'lastSignInAt', 'actions'];

  protected search(q: string): void {
    this.list.filters.set({ q: q.trim() });
  }

  protected changePage(event: PageEvent): void {
    this.list.turn(event);
  }

  protected openEditor(user: UserDto | null): void {
    this.dialog
      .open(UserDialog, { data: user, autoFocus: 'first-tabbable' })
      .afterClosed()
      .subscribe((saved) => {
        if (!saved) return;
        this.users.reload();
        this.pendingGrants().reload();
      });
  }

  protected async toggleActive(user: UserDto): Promise<void> {
    try {
      await this.api.setActive(user.id, !user.active);
      this.snackBar.open(
        `${user.displayName} is now ${user.active ? 'deactivated; their sessions have ended' : 'active again'}.`,
        'OK',
        { duration: 5000 },
      );
      this.users.reload();
    } catch (error) {
      assertApiFailure(error);
      this.snackBar.open(error.message, 'OK', { duration: 8000 });
    }
  }
}
