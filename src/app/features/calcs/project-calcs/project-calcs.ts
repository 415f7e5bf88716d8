import { ChangeDetectionStrategy, Component, computed, effect, inject, input, numberAttribute } from '@angular/core';
import { DatePipe } from '@angular/common';
import { Router, RouterLink } from '@angular/router';
import { MatTableModule } from '@angular/material/table';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatDialog } from '@angular/material/dialog';
import { AbilityServiceSignal } from '@casl/angular';
import type { AppAbility } from '../../../../../shared/authz/app-ability';
import { REVISION_STATES, STATE_LABELS } from '../../../../../shared/schemas/revision.schema';
import { EmptyState } from '../../../ui/empty-state';
import { LoadFailure } from '../../../ui/load-failure';
import { ProjectsApi } from '../../projects/projects-api';
import { StateBadge } from '../../../ui/state-badge';
import { VerdictBadge } from '../../../ui/verdict-badge';
import { CalcsApi, type CalcListParams } from '../calcs-api';
import { KEYSET_PAGINATOR_INTL, keysetPager } from '../../../ui/keyset-paginator-intl';
import { ListFilters } from '../../../ui/list-filters';
import { NewCalcDialog } from '../new-calc/new-calc-dialog';

@Component({
  selector: 'tt-project-calcs',
  imports: [
    DatePipe,
    RouterLink,
    MatTableModule,
    MatSortModule,
    MatPaginatorModule,
    MatButtonModule,
    MatIconModule,
    MatSelectModule,
    MatFormFieldModule,
    MatInputModule,
    MatProgressBarModule,
    EmptyState,
    StateBadge,
    VerdictBadge,
    LoadFailure,
  ],
  templateUrl: './project-calcs.html',
  styleUrl: './project-calcs.scss',
  providers: [KEYSET_PAGINATOR_INTL],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class ProjectCalcs {
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly ability = inject<AbilityServiceSignal<AppAbility>>(AbilityServiceSignal);
  readonly id = input.required({ transform: numberAttribute });

  protected readonly project = inject(ProjectsApi).one(this.id);
  protected readonly projectInfo = computed(() => (this.project.hasValue() ? this.project.value() : undefined));
  protected readonly pager = keysetPager(25);
  /**
   * Search, state and order; a change goes back to the first page, one that changes nothing keeps the page: leaving
   * the search box (blur) after Enter, by clicking "next page", used to send the pager back while the click turned it,
   * and the first page's rows showed as "26 – 50".
   */
  private readonly filters = new ListFilters<Omit<CalcListParams, 'projectId' | 'size' | 'after'>>(
    { q: '', sort: 'updatedAt', dir: 'desc' },
    () => this.pager.reset(),
  );
  protected readonly params = this.filters.value;
  protected readonly calcs = inject(CalcsApi).list(
    computed(() => ({ ...this.params(), projectId: this.id(), size: this.pager.size(), after: this.pager.after() })),
  );
  protected readonly rows = computed(() => (this.calcs.hasValue() ? this.calcs.value().items : []));
  /** The search looked through its bound of calcs before this page filled: the rows are all matches so far. */
  protected readonly stoppedEarly = computed(() => this.calcs.hasValue() && this.calcs.value().stoppedEarly);
  protected readonly isFiltered = computed(() => Boolean(this.params().q || this.params().status));
  protected readonly canCreate = computed(
    () => this.ability.can('create', 'Calc') && this.projectInfo()?.status === 'active',
  );
  protected readonly states = REVISION_STATES.map((s) => ({ value: s, label: STATE_LABELS[s] }));
  protected readonly columns = ['number', 'title', 'revision', 'status', 'verdict', 'author', 'updatedAt'];

  constructor() {
    effect(() => {
      if (this.calcs.hasValue()) this.pager.remember(this.calcs.value());
    });
  }

  protected filter(patch: Partial<CalcListParams>): void {
    this.filters.set(patch);
  }

  protected sortBy(sort: Sort): void {
    this.filters.set({ sort: sort.direction ? sort.active : 'updatedAt', dir: sort.direction || 'desc' });
  }

  protected changePage(e: PageEvent): void {
    this.pager.turn(e);
  }

  protected startCalc(): void {
    this.dialog
      .open(NewCalcDialog, { data: this.projectInfo(), autoFocus: 'first-tabbable', width: '620px' })
      .afterClosed()
      .subscribe((created?: { calcId: number; revisionId: number }) => {
        if (created) void this.router.navigate(['/revisions', created.revisionId, 'edit']);
      });
  }
}
