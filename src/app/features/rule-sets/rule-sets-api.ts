import { Injectable, inject, type Signal } from '@angular/core';
import { HttpClient, httpResource } from '@angular/common/http';
import { firstValueFrom } from 'rxjs';
import type { Checklist, RuleSetDiff } from '../../../../shared/rules';
import type { ImpactReport, RuleSetDto, RuleSetSummary } from '../../../../shared/schemas/rule-set.schema';

export interface DiffResponse {
  from: { id: number; code: string; version: number };
  to: { id: number; code: string; version: number };
  changes: RuleSetDiff;
}
export interface TryItResponse {
  ruleSet: { code: string; version: number };
  revision: { id: number; label: string };
  checklist: Checklist;
  before: Checklist | null;
}

/** Design standards: versions, drafts, confirmation, diff, try-it and impact analysis. */
@Injectable({ providedIn: 'root' })
export class RuleSetsApi {
  private readonly http = inject(HttpClient);

  list() {
    return httpResource<RuleSetSummary[]>(() => '/api/rule-sets');
  }

  one(id: Signal<number>) {
    return httpResource<RuleSetDto>(() => `/api/rule-sets/${id()}`);
  }

  diff(from: Signal<number>, to: Signal<number>) {
    return httpResource<DiffResponse>(() =>
      from() && to() ? { url: '/api/rule-sets/diff', params: { from: from(), to: to() } } : undefined,
    );
  }

  createDraft(fromId: number): Promise<RuleSetDto> {
    return firstValueFrom(this.http.post<RuleSetDto>('/api/rule-sets', { fromId }));
  }

  save(id: number, document: Record<string, unknown>, lockVersion: number): Promise<RuleSetDto> {
    return firstValueFrom(this.http.put<RuleSetDto>(`/api/rule-sets/${id}`, { document, lockVersion }));
  }

  propose(id: number, effectiveDate: string, lockVersion: number): Promise<RuleSetDto> {
    return firstValueFrom(this.http.post<RuleSetDto>(`/api/rule-sets/${id}/propose`, { effectiveDate, lockVersion }));
  }

  confirm(id: number, password: string, lockVersion: number): Promise<RuleSetDto> {
    return firstValueFrom(this.http.post<RuleSetDto>(`/api/rule-sets/${id}/confirm`, { password, lockVersion }));
  }

  tryIt(id: number, revisionId: number): Promise<TryItResponse> {
    return firstValueFrom(this.http.post<TryItResponse>(`/api/rule-sets/${id}/try`, { revisionId }));
  }

  impact(id: number): Promise<ImpactReport> {
    return firstValueFrom(this.http.get<ImpactReport>(`/api/rule-sets/${id}/impact`));
  }
}
