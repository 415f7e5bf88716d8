import { Injectable, inject, type Signal } from '@angular/core';
import { HttpClient, httpResource } from '@angular/common/http';
import { firstValueFrom } from 'rxjs';
import type { IndependentModelDto } from '../../../../../shared/schemas/independent-model.schema';
import type { RuleSetDto } from '../../../../../shared/schemas/rule-set.schema';

/** The checker's independent model of a revision (server/independent/), and the standard it is built against. */
@Injectable({ providedIn: 'root' })
export class IndependentModelApi {
  private readonly http = inject(HttpClient);
  private url = (revisionId: number) => `/api/revisions/${revisionId}/independent-model`;

  /** The model of a revision; `undefined` reads nothing (no model yet, or not the reader's to see). */
  model(revisionId: Signal<number | undefined>) {
    return httpResource<IndependentModelDto>(() => {
      const id = revisionId();
      return id ? this.url(id) : undefined;
    });
  }

  standard(ruleSetId: Signal<number | undefined>) {
    return httpResource<RuleSetDto>(() => (ruleSetId() ? `/api/rule-sets/${ruleSetId()}` : undefined));
  }

  /** Saves the draft; a stale `lockVersion` is a 409 and nothing is overwritten. */
  save(revisionId: number, input: Record<string, unknown>, lockVersion: number): Promise<IndependentModelDto> {
    return firstValueFrom(this.http.put<IndependentModelDto>(this.url(revisionId), { input, lockVersion }));
  }

  lock(revisionId: number, lockVersion: number): Promise<IndependentModelDto> {
    return firstValueFrom(this.http.post<IndependentModelDto>(`${this.url(revisionId)}/lock`, { lockVersion }));
  }
}
