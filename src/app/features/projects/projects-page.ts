import { ChangeDetectionStrategy, Component, computed, inject, type Signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatTableModule } from '@angular/material/table';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatDialog } from '@angular/material/dialog';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { AbilityServiceSignal } from '@casl/angular';
import type { AppAbility } from '../../../../shared/authz/app-ability';
import type { ProjectDto } from '../../../../shared/schemas/project.schema';
import { EmptyState } from '../../ui/empty-state';
import { LoadFailure } from '../../ui/load-failure';
import { pagedFilters } from '../../ui/list-filters';
import { ProjectsApi, type ProjectListParams } from './projects-api';
import { ProjectDialog } from './project-dialog';

@Component({
  selector: 'tt-projects-page',
  imports: [
    DatePipe,
    RouterLink,
    MatTableModule,
    MatPaginatorModule,
    MatButtonModule,
    MatIconModule,
    MatFormFieldModule,
    MatInputModule,
    MatProgressBarModule,
    EmptyState,
    LoadFailure,
  ],
  templateUrl: './projects-page.html',
  styleUrl: './projects-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class ProjectsPage {
  private readonly dialog = inject(MatDialog);
  private readonly ability = inject<AbilityServiceSignal<AppAbility>>(AbilityServiceSignal);

  private readonly list = pagedFilters<Pick<ProjectListParams, 'q'>>({ q: '' });
  protected readonly params: Signal<ProjectListParams> = this.list.params;
  protected readonly projects = inject(ProjectsApi).list(this.params);
  protected readonly rows = computed(() => (this.projects.hasValue() ? this.projects.value().items : []));
  protected readonly total = computed(() => (this.projects.hasValue() ? this.projects.value().total : 0));
  protected readonly canCreate = computed(() => this.ability.can('create', 'Project'));
  protected readonly canEdit = computed(() => this.ability.can('update', 'Project'));
  protected readonly columns = computed(() => [
    'code',
    'name',
    'client',
    'revisionScheme',
    'status',
    'createdAt',
    ...(this.canEdit() ? ['actions'] : []),
  ]);

  protected search(q: string): void {
    this.list.filters.set({ q: q.trim() });
  }

  protected changePage(event: PageEvent): void {
    this.list.turn(event);
  }

  protected openEditor(project: ProjectDto | null): void {
    this.dialog
      .open(ProjectDialog, { data: project, autoFocus: 'first-tabbable' })
      .afterClosed()
      .subscribe((saved) => {
        if (saved) this.projects.reload();
      });
  }
}
