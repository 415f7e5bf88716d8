import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { DatePipe, JsonPipe, SlicePipe } from '@angular/common';
import { MatTableModule } from '@angular/material/table';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { AuditChainStatus, AuditEventDto } from '../../../../shared/schemas/audit.schema';
import { toHttpFailure } from '../../core/errors/http-failure';
import { AuditActionLabelPipe } from '../../ui/audit-action-label';
import { EmptyState } from '../../ui/empty-state';
import { AuditApi, type AuditListParams } from './audit-api';

@Component({
  selector: 'tt-audit-page',
  imports: [DatePipe, JsonPipe, SlicePipe, MatTableModule, MatPaginatorModule, MatButtonModule, MatIconModule, MatSelectModule, MatFormFieldModule, MatProgressBarModule, AuditActionLabelPipe, EmptyState],
  templateUrl: './audit-page.html',
  styleUrl: './audit-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class AuditPage {
  private readonly api = inject(AuditApi);
  protected readonly params = signal<AuditListParams>({ page: 0, size: 25, entityType: '' });
  protected readonly events = this.api.list(this.params);
  protected readonly rows = computed(() => this.events.value()?.items ?? []);
  protected readonly total = computed(() => this.events.value()?.total ?? 0);
  protected readonly error = computed(() => (this.events.error() ? toHttpFailure(this.events.error()).message : null));
  protected readonly expanded = signal<number | null>(null);
  protected readonly chain = signal<AuditChainStatus | null>(null);
  protected readonly chainError = signal<string | null>(null);
  protected readonly isVerifying = signal(false);
  protected readonly columns = ['id', 'occurredAt', 'actorName', 'action', 'entity', 'hash'];
  protected readonly entityTypes = ['', 'User', 'Project'];

  protected filter(entityType: string): void {
    this.params.update((p) => ({ ...p, entityType, page: 0 }));
  }

  protected changePage(event: PageEvent): void {
    this.params.update((p) => ({ ...p, page: event.pageIndex, size: event.pageSize }));
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
      this.chainError.set(toHttpFailure(error).message);
    } finally {
      this.isVerifying.set(false);
    }
  }
}
