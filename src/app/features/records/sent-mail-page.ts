import { ChangeDetectionStrategy, Component, computed, inject, signal, type Signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { MatTableModule } from '@angular/material/table';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MAIL_EVENT_INFO, MAIL_EVENTS, type SentMailDto } from '../../../../shared/schemas/mail.schema';
import { assertApiFailure } from '../../core/http/api-failure';
import { EmptyState } from '../../ui/empty-state';
import { LoadFailure } from '../../ui/load-failure';
import { pagedFilters } from '../../ui/list-filters';
import { RecordsApi, type SentMailParams } from './records-api';

/** Admins read the mail outbox: what was sent, to whom, and what is still retrying or gave up. */
@Component({
  selector: 'tt-sent-mail-page',
  imports: [
    DatePipe,
    MatTableModule,
    MatPaginatorModule,
    MatFormFieldModule,
    MatSelectModule,
    MatIconModule,
    MatProgressBarModule,
    EmptyState,
    LoadFailure,
  ],
  templateUrl: './sent-mail-page.html',
  styleUrl: './sent-mail-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class SentMailPage {
  private readonly api = inject(RecordsApi);
  private readonly list = pagedFilters<Pick<SentMailParams, 'status' | 'event'>>({ status: '', event: '' });
  protected readonly params: Signal<SentMailParams> = this.list.params;
  protected readonly mail = this.api.sentMail(this.params);
  protected readonly rows = computed(() => (this.mail.hasValue() ? this.mail.value().items : []));
  protected readonly total = computed(() => (this.mail.hasValue() ? this.mail.value().total : 0));
  protected readonly opened = signal<SentMailDto | null>(null);
  protected readonly openError = signal<string | null>(null);
  protected readonly columns = ['id', 'createdAt', 'event', 'recipient', 'subject', 'status'];
  protected readonly statuses = [
    { value: '', label: 'Any status' },
    { value: 'sent', label: 'Sent' },
    { value: 'pending', label: 'Waiting or retrying' },
    { value: 'failed', label: 'Gave up' },
  ] as const;

  /** The hand-overs named as a person's mail settings name them, then the role-change notices. */
  protected readonly kinds: readonly { value: SentMailParams['event']; label: string }[] = [
    { value: '', label: 'Any kind' },
    ...MAIL_EVENTS.map((value) => ({ value, label: MAIL_EVENT_INFO[value].label })),
    { value: 'role_change', label: 'Role changed' },
  ];

  /** The kind's words as the filter names it; a kind this screen does not know yet shows as stored. */
  protected kindOf(event: string): string {
    return this.kinds.find((k) => k.value === event)?.label ?? event;
  }

  protected filterStatus(status: SentMailParams['status']): void {
    this.list.filters.set({ status });
  }

  protected filterKind(event: SentMailParams['event']): void {
    this.list.filters.set({ event });
  }

  protected changePage(event: PageEvent): void {
    this.list.turn(event);
  }

  protected async open(row: SentMailDto): Promise<void> {
    if (this.opened()?.id === row.id) return this.opened.set(null);
    this.openError.set(null);
    try {
      this.opened.set(await this.api.sentMailOne(row.id));
    } catch (error) {
      assertApiFailure(error);
      this.openError.set(error.message);
    }
  }
}
