import { Injectable, inject, type Signal } from '@angular/core';
import { HttpClient, httpResource } from '@angular/common/http';
import { firstValueFrom } from 'rxjs';
import type { KeysetPage } from '../../../../shared/schemas/common.schema';
import type { AuditChainStatus, AuditEventDto } from '../../../../shared/schemas/audit.schema';

export interface AuditListParams {
  size: number;
  after?: string;
  entityType: string;
  action: string;
  projectId: number | null;
  calcId: number | null;
  userId: number | null;
  from: string;
  to: string;
}

@Injectable({ providedIn: 'root' })
export class AuditApi {
  private readonly http = inject(HttpClient);

  list(params: Signal<AuditListParams>) {
    return httpResource<KeysetPage<AuditEventDto>>(() => ({
      url: '/api/audit',
      params: Object.fromEntries(
        Object.entries(params()).filter(([, v]) => v !== '' && v !== null && v !== undefined),
      ) as Record<string, string | number>,
    }));
  }

  /** One entry with its diff, which lists leave out. */
  entry(id: Signal<number | null>) {
    return httpResource<AuditEventDto>(() => (id() ? `/api/audit/${id()}` : undefined));
  }

  /** People who appear in the trail, for the person filter. */
  people() {
    return httpResource<{ id: number; name: string }[]>(() => '/api/audit/people');
  }

  verifyChain(): Promise<AuditChainStatus> {
    return firstValueFrom(this.http.get<AuditChainStatus>('/api/audit/verify'));
  }
}
