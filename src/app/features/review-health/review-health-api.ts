import { Injectable, inject, type Signal } from '@angular/core';
import { HttpClient, httpResource } from '@angular/common/http';
import { firstValueFrom } from 'rxjs';
import type {
  HealthReport,
  HealthSettingsDto,
  SignalKey,
  SignalPage,
  UpdateHealthSettings,
} from '../../../../shared/schemas/review-health.schema';

export interface HealthParams {
  projectId: number | null;
  from: string;
  to: string;
}

/** The query string of the report and its CSV: the project only when one is chosen. */
export function healthQuery(p: HealthParams): Record<string, string> {
  return { ...(p.projectId ? { projectId: String(p.projectId) } : {}), from: p.from, to: p.to };
}

/** Server state of the review-health screen: the signals of a project and period, and the thresholds. */
@Injectable({ providedIn: 'root' })
export class ReviewHealthApi {
  private readonly http = inject(HttpClient);

  /** No request while the period is unfinished (the form says what is wrong). */
  report(params: Signal<HealthParams | null>) {
    return httpResource<HealthReport>(() => {
      const p = params();
      return p ? { url: '/api/review-health', params: healthQuery(p) } : undefined;
    });
  }

  /** The page of one signal's rows after `after` (the `next` of the page before), for the same project and period. */
  signalPage(key: SignalKey, p: HealthParams, after: string): Promise<SignalPage> {
    return firstValueFrom(
      this.http.get<SignalPage>(`/api/review-health/signals/${key}`, { params: { ...healthQuery(p), after } }),
    );
  }

  settings() {
    return httpResource<HealthSettingsDto>(() => '/api/review-health/settings');
  }

  saveSettings(dto: UpdateHealthSettings): Promise<HealthSettingsDto> {
    return firstValueFrom(this.http.put<HealthSettingsDto>('/api/review-health/settings', dto));
  }

  csvLink(p: HealthParams): string {
    return `/api/review-health/signals.csv?${new URLSearchParams(healthQuery(p))}`;
  }
}
