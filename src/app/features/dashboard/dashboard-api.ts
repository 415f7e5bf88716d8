import { Injectable } from '@angular/core';
import { httpResource } from '@angular/common/http';
import type { DashboardDto } from '../../../../shared/schemas/dashboard.schema';

@Injectable({ providedIn: 'root' })
export class DashboardApi {
  /** A fresh resource per page visit, so the overview never shows stale hand-overs. */
  overview() {
    return httpResource<DashboardDto>(() => '/api/dashboard');
  }
}
