import { Injectable, inject } from '@angular/core';
import { HttpClient } from '@angular/common/http';
import { firstValueFrom } from 'rxjs';
import type { IndependentModelDto } from '../../../../../shared/schemas/independent-model.schema';

/** The checker's independent model of a revision (server/independent/). */
@Injectable({ providedIn: 'root' })
export class IndependentModelApi {
  private readonly http = inject(HttpClient);
  private url = (revisionId: number) => `/api/revisions/${revisionId}/independent-model`;

  read(revisionId: number): Promise<IndependentModelDto> {
    return firstValueFrom(this.http.get<IndependentModelDto>(this.url(revisionId)));
  }

  save(revisionId: number, input: Record<string, unknown>, lockVersion: number): Promise<IndependentModelDto> {
    return firstValueFrom(this.http.put<IndependentModelDto>(this.url(revisionId), { input, lockVersion }));
  }

  lock(revisionId: number, lockVersion: number): Promise<IndependentModelDto> {
    return firstValueFrom(this.http.post<IndependentModelDto>(`${this.url(revisionId)}/lock`, { lockVersion }));
  }
}
