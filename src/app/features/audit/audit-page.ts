import { ChangeDetectionStrategy, Component, computed, effect, inject, signal } from '@angular/core';
import { DatePipe, JsonPipe, SlicePipe } from '@angular/common';
import { MatTableModule } from '@angular/material/table';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { AuditEventDto } from '../../../../shared/schemas/audit.schema';
import { LoadFailure } from '../../ui/load-failure';
import { AuditActionLabelPipe } from '../../ui/audit-action-label';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { CalcsApi } from '../calcs/calcs-api';
import { EmptyState } from '../../ui/empty-state';
import { AuditApi, type AuditListParams } from './audit-api';
import { KEYSET_PAGINATOR_INTL, keysetPager } from '../../ui/keyset-paginator-intl';
import { ListFilters } from '../../ui/list-filters';
import { ProjectPicker } from '../projects/project-picker';
import { DiffView } from '../../ui/diff-view';
import { MatInputModule } from '@angular/material/input';
import { AUDIT_ACTION_FILTERS, AUDIT_ENTITY_TYPES, ISO_DAY, filtersFromUrl } from './audit-filters';
import { ChainCheck } from './chain-check';

@Component({
  selector: 'tt-audit-page',
  imports: [
    DatePipe,
    JsonPipe,
    SlicePipe,
    MatTableModule,
    MatPaginatorModule,
    MatButtonModule,
    MatIconModule,
    MatSelectModule,
    MatFormFieldModule,
    MatProgressBarModule,
    AuditActionLabelPipe,
    EmptyState,
    DiffView,
    MatInputModule,
    RouterLink,
    ReactiveFormsModule,
    LoadFailure,
    ProjectPicker,
  ],
  providers: [KEYSET_PAGINATOR_INTL, ChainCheck],
  templateUrl: './audit-page.html',
  styleUrl: './audit-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class AuditPage {
  private readonly api = inject(AuditApi);
  protected readonly chainCheck = inject(ChainCheck);
  protected readonly pager = keysetPager(25);
  // Filters may arrive in the address (links from review-health signals and elsewhere), e.g.
  // /audit?calcId=7&action=revision.signed.
  private readonly filters = new ListFilters<Omit<AuditListParams, 'size' | 'after'>>(
    filtersFromUrl(inject(ActivatedRoute).snapshot.queryParamMap),
    () => this.pager.reset(),
  );
  protected readonly params = this.filters.value;
  protected readonly events = this.api.list(
    computed(() => ({ ...this.params(), size: this.pager.size(), after: this.pager.after() })),
  );
  protected readonly rows = computed(() => (this.events.hasValue() ? this.events.value().items : []));
  protected readonly people = this.api.people();
  protected readonly calcs = inject(CalcsApi).list(
    computed(() => ({
      size: 200,
      sort: 'number' as const,
      dir: 'asc' as const,
      projectId: this.params().projectId ?? undefined,
      status: undefined,
      q: '',
    })),
  );
  /** Dates typed the ISO way whatever the browser's locale (a date input shows mm/dd/yyyy in US English). */
  protected readonly from = new FormControl('', { nonNullable: true, validators: Validators.pattern(ISO_DAY) });
  protected readonly to = new FormControl('', { nonNullable: true, validators: Validators.pattern(ISO_DAY) });
  protected readonly calcOptions = computed(() => (this.calcs.hasValue() ? this.calcs.value().items : []));
  protected readonly personOptions = computed(() => (this.people.hasValue() ? this.people.value() : []));
  protected readonly filterError = computed(() => this.calcs.error() ?? this.people.error());
  protected readonly expanded = signal<number | null>(null);
  // Lists leave diffs out; the open entry's diff is read on its own.
  protected readonly openEntry = this.api.entry(
    computed(() => {
      const id = this.expanded();
      return id !== null && this.rows().find((e) => e.id === id)?.hasDiff ? id : null;
    }),
  );
  protected readonly openDiff = computed(() => (this.openEntry.hasValue() ? this.openEntry.value().diff : null));
  protected readonly columns = ['id', 'occurredAt', 'actorName', 'action', 'entity', 'hash'];
  protected readonly entityTypes = AUDIT_ENTITY_TYPES;
  protected readonly actions = AUDIT_ACTION_FILTERS;

  constructor() {
    this.from.setValue(this.params().from, { emitEvent: false });
    this.to.setValue(this.params().to, { emitEvent: false });
    effect(() => {
      if (this.events.hasValue()) this.pager.remember(this.events.value());
    });
    for (const [control, key] of [
      [this.from, 'from'],
      [this.to, 'to'],
    ] as const) {
      control.valueChanges.pipe(takeUntilDestroyed()).subscribe((v) => {
        const day = v.trim();
        // Only a changed, complete date reads the list again (clearing an empty field changes nothing).
        if (day === this.params()[key]) return;
        if (day === '' || (ISO_DAY.test(day) && !Number.isNaN(Date.parse(`${day}T00:00:00Z`))))
          this.filter({ [key]: day });
      });
    }
  }

  protected filter(patch: Partial<AuditListParams>): void {
    // A calc belongs to one project: changing the project clears the calc.
    const calc = 'projectId' in patch ? { calcId: null } : {};
    this.filters.set({ ...calc, ...patch });
  }

  protected linkPath(link: string): string {
    return link.split('?')[0];
  }

  protected linkQuery(link: string): Record<string, string> {
    const query: Record<string, string> = {};
    new URLSearchParams(link.split('?')[1] ?? '').forEach((value, key) => {
      query[key] = value;
    });
    return query;
  }

  protected changePage(event: PageEvent): void {
    this.pager.turn(event);
  }

  protected reloadFilters(): void {
    for (const list of [this.calcs, this.people]) if (list.error()) list.reload();
  }

  protected toggle(event: AuditEventDto): void {
    this.expanded.update((id) => (id === event.id ? null : event.id));
  }
}
