import { Injectable, inject } from '@angular/core';
import { HttpClient, httpResource } from '@angular/common/http';
import { firstValueFrom } from 'rxjs';
import { activeSessionsSchema, type ActiveSessionDto } from '../../../../shared/schemas/session-list.schema';

/** The signed-in person's own sessions. */
@Injectable({ providedIn: 'root' })
export class SessionsApi {
  private readonly http = inject(HttpClient);

  sessions() {
    return httpResource<ActiveSessionDto[]>(() => '/api/auth/sessions', {
      parse: (raw) => activeSessionsSchema.parse(raw),
    });
  }

  end(id: string): Promise<void> {
    return firstValueFrom(this.http.delete<void>(`/api/auth/sessions/${id}`));
  }
}
