import { ChangeDetectionStrategy, Component, computed, effect, inject, signal } from '@angular/core';
import { DatePipe, JsonPipe, SlicePipe } from '@angular/common';
import { MatTableModule } from '@angular/material/table';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { AuditChainStatus, AuditEventDto } from '../../../../shared/schemas/audit.schema';
import { assertApiFailure } from '../../core/http/api-failure';
import { LoadFailure } from '../../ui/load-failure';
import { AuditActionLabelPipe } from '../../ui/audit-action-label';
import { ActivatedRoute, RouterLink, type ParamMap } from '@angular/router';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { CalcsApi } from '../calcs/calcs-api';
import { EmptyState } from '../../ui/empty-state';
import { AuditApi, type AuditListParams } from './audit-api';
import { KeysetPager } from '../../ui/keyset-pager';
import { ProjectsApi } from '../projects/projects-api';
import { DiffView } from '../../ui/diff-view';
import { MatInputModule } from '@angular/material/input';

const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/;

/** The audit filters named in the address; anything malformed is left out (the server validates the rest). */
function filtersFromUrl(q: ParamMap): Omit<AuditListParams, 'size' | 'after'> {
  const id = (key: string) => (/^[1-9]\d{0,14}$/.test(q.get(key) ?? '') ? Number(q.get(key)) : null);
  const text = (key: string, pattern = /^[\w.]{0,64}$/) => (pattern.test(q.get(key) ?? '') ? (q.get(key) ?? '') : '');
  return {
    entityType: text('entityType'),
    action: text('action'),
    projectId: id('projectId'),
    calcId: id('calcId'),
    userId: id('userId'),
    from: text('from', ISO_DAY),
    to: text('to', ISO_DAY),
  };
}

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
  ],
  templateUrl: './audit-page.html',
  styleUrl: './audit-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class AuditPage {
  private readonly api = inject(AuditApi);
  // Filters may arrive in the address (links from review-health signals and elsewhere), e.g.
  // /audit?calcId=7&action=revision.signed.
  protected readonly params = signal<Omit<AuditListParams, 'size' | 'after'>>(
    filtersFromUrl(inject(ActivatedRoute).snapshot.queryParamMap),
  );
  protected readonly pager = new KeysetPager(25);
  protected readonly projects = inject(ProjectsApi).list(signal({ page: 0, size: 200, q: '' }));
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
  protected readonly projectOptions = computed(() => (this.projects.hasValue() ? this.projects.value().items : []));
  protected readonly calcOptions = computed(() => (this.calcs.hasValue() ? this.calcs.value().items : []));
  protected readonly personOptions = computed(() => (this.people.hasValue() ? this.people.value() : []));
  protected readonly filterError = computed(() => this.projects.error() ?? this.calcs.error() ?? this.people.error());
  protected readonly expanded = signal<number | null>(null);
  // Lists leave diffs out; the open entry's diff is read on its own.
  protected readonly openEntry = this.api.entry(
    computed(() => {
      const id = this.expanded();
      return id !== null && this.rows().find((e) => e.id === id)?.hasDiff ? id : null;
    }),
  );
  protected readonly openDiff = computed(() => (this.openEntry.hasValue() ? this.openEntry.value().diff : null));
  protected readonly chain = signal<AuditChainStatus | null>(null);
  protected readonly chainError = signal<string | null>(null);
  protected readonly isVerifying = signal(false);
  protected readonly columns = ['id', 'occurredAt', 'actorName', 'action', 'entity', 'hash'];
  protected readonly entityTypes = ['', 'User', 'Project', 'Calc', 'Revision', 'RuleSet'];
  protected readonly actions = [
    { value: '', label: 'Any action' },
    { value: 'auth.', label: 'Sign-in and passwords' },
    { value: 'user.', label: 'Accounts and roles' },
    { value: 'calc.', label: 'Calcs created' },
    { value: 'revision.saved', label: 'Content saved' },
    { value: 'revision.signed', label: 'Signatures' },
    { value: 'revision.', label: 'Any revision event' },
    { value: 'finding.', label: 'Findings' },
    { value: 'rule_set.', label: 'Standards' },
    { value: 'attachment.', label: 'Attachments' },
    { value: 'revision.signed_checked', label: 'Check signatures' },
    { value: 'revision.signed_approved', label: 'Approval signatures' },
    { value: 'revision.signed_authored', label: 'Submissions' },
    { value: 'revision.signature_refused', label: 'Refused signatures' },
    { value: 'review_health.', label: 'Review-health settings' },
  ];

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
    this.pager.reset();
    this.params.update((p) => ({ ...p, ...calc, ...patch }));
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
    for (const list of [this.projects, this.calcs, this.people]) if (list.error()) list.reload();
  }

  protected toggle(event: AuditEventDto): void {
    this.expanded.update((id) => (id === event.id ? null : event.id));
  }

  protected async verify(): Promise<void> {
    this.isVerifying.set(true);
    this.chainError.set(null);
    try {
      this.chain.set(await this.api.verifyChain());
    } catch (error) {
      assertApiFailure(error);
      this.chainError.set(error.message);
    } finally {
      this.isVerifying.set(false);
    }
  }
}
