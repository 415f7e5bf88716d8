import { Injectable, inject, type Signal } from '@angular/core';
import { HttpClient, httpResource } from '@angular/common/http';
import { firstValueFrom } from 'rxjs';
import type { CalcDto, CalcListPage, RevisionDto } from '../../../../shared/schemas/calc-dto';
import type { CreateCalcRequest, SaveRevisionRequest, SignRequest } from '../../../../shared/schemas/revision.schema';
import type { QueueDto } from '../../../../shared/schemas/queue.schema';
import type { FindingAnchor } from '../../../../shared/format';
import type { RuleSetDto, RuleSetSummary } from '../../../../shared/schemas/rule-set.schema';

/** Rows per page of a queue on the overview; the first page of every queue comes with the overview. */
export const QUEUE_PAGE = 5;

export interface CalcListParams {
  projectId?: number;
  status?: string;
  q: string;
  size: number;
  after?: string;
  sort: string;
  dir: 'asc' | 'desc';
}

/** Server state of calcs and revisions; pages read its resources and call its commands. */
@Injectable({ providedIn: 'root' })
export class CalcsApi {
  private readonly http = inject(HttpClient);

  list(params: Signal<CalcListParams>) {
    return httpResource<CalcListPage>(() => {
      const p = params();
      const query: Record<string, string | number> = { size: p.size, sort: p.sort, dir: p.dir };
      if (p.after) query['after'] = p.after;
      if (p.projectId) query['projectId'] = p.projectId;
      if (p.status) query['status'] = p.status;
      if (p.q) query['q'] = p.q;
      return { url: '/api/calcs', params: query };
    });
  }

  calc(id: Signal<number | undefined>) {
    return httpResource<CalcDto>(() => (id() ? `/api/calcs/${id()}` : undefined));
  }

  revision(id: Signal<number | undefined>) {
    return httpResource<RevisionDto>(() => (id() ? `/api/revisions/${id()}` : undefined));
  }

  /** A revision by id, or without one the calc's newest: read beside the calc, never after it. */
  revisionOf(calcId: Signal<number | undefined>, revisionId: Signal<number | undefined>) {
    return httpResource<RevisionDto>(() => {
      if (revisionId()) return `/api/revisions/${revisionId()}`;
      return calcId() ? `/api/calcs/${calcId()}/latest-revision` : undefined;
    });
  }

  queues() {
    return httpResource<QueueDto[]>(() => ({ url: '/api/dashboard/queues', params: { size: QUEUE_PAGE } }));
  }

  /** Further pages of one queue, by keyset from the previous page's `next`. */
  queuePage(key: Signal<string>, params: Signal<{ size: number; after?: string } | undefined>) {
    return httpResource<QueueDto>(() => {
      const p = params();
      if (!p) return undefined;
      const query: Record<string, string | number> = { size: p.size };
      if (p.after) query['after'] = p.after;
      return { url: `/api/dashboard/queues/${key()}`, params: query };
    });
  }

  ruleSets() {
    return httpResource<RuleSetSummary[]>(() => '/api/rule-sets');
  }

  getRuleSet(id: number): Promise<RuleSetDto> {
    return firstValueFrom(this.http.get<RuleSetDto>(`/api/rule-sets/${id}`));
  }

  getRevision(id: number): Promise<RevisionDto> {
    return firstValueFrom(this.http.get<RevisionDto>(`/api/revisions/${id}`));
  }

  create(dto: CreateCalcRequest): Promise<CalcDto> {
    return firstValueFrom(this.http.post<CalcDto>('/api/calcs', dto));
  }

  /** Explicit, versioned save; a 409 carries the stored revision as `current`. */
  save(id: number, dto: SaveRevisionRequest): Promise<RevisionDto> {
    return firstValueFrom(this.http.put<RevisionDto>(`/api/revisions/${id}`, dto));
  }

  sign(id: number, dto: SignRequest): Promise<RevisionDto> {
    return firstValueFrom(this.http.post<RevisionDto>(`/api/revisions/${id}/sign`, dto));
  }

  returnToAuthor(id: number, reason: string, lockVersion: number): Promise<RevisionDto> {
    return firstValueFrom(this.http.post<RevisionDto>(`/api/revisions/${id}/return`, { reason, lockVersion }));
  }

  withdraw(id: number, reason: string, lockVersion: number): Promise<RevisionDto> {
    return firstValueFrom(this.http.post<RevisionDto>(`/api/revisions/${id}/withdraw`, { reason, lockVersion }));
  }

  newRevision(calcId: number, reasonForChange: string, carryAttachments: boolean): Promise<RevisionDto> {
    return firstValueFrom(
      this.http.post<RevisionDto>(`/api/calcs/${calcId}/revisions`, { reasonForChange, carryAttachments }),
    );
  }

  /** A finding on the calc, or anchored to a checklist row (clause and location) or a named input. */
  raiseFinding(
    revisionId: number,
    text: string,
    anchor: FindingAnchor = { clauseRef: null, anchorPath: null },
  ): Promise<RevisionDto> {
    const where = {
      ...(anchor.clauseRef ? { clauseRef: anchor.clauseRef } : {}),
      ...(anchor.anchorPath ? { anchorPath: anchor.anchorPath } : {}),
    };
    return firstValueFrom(this.http.post<RevisionDto>(`/api/revisions/${revisionId}/findings`, { text, ...where }));
  }

  answerFinding(findingId: number, answer: string): Promise<RevisionDto> {
    return firstValueFrom(this.http.post<RevisionDto>(`/api/findings/${findingId}/answer`, { answer }));
  }

  closeFinding(findingId: number): Promise<RevisionDto> {
    return firstValueFrom(this.http.post<RevisionDto>(`/api/findings/${findingId}/close`, {}));
  }

  setManualItem(revisionId: number, itemId: string, done: boolean, note = ''): Promise<RevisionDto> {
    return firstValueFrom(
      this.http.put<RevisionDto>(`/api/revisions/${revisionId}/manual-items/${itemId}`, { done, note }),
    );
  }

  diff(calcId: number, from: number, to: number) {
    return firstValueFrom(
      this.http.get<{ input: string | null; checklist: string | null }>(`/api/calcs/${calcId}/diff`, {
        params: { from, to },
      }),
    );
  }
}
