import { Injectable, inject } from '@angular/core';
import { HttpClient, httpResource } from '@angular/common/http';
import { firstValueFrom } from 'rxjs';
import type { MailEvent, MailPreferenceDto } from '../../../../shared/schemas/mail.schema';

/** The signed-in person's mail choices, one per event. */
@Injectable({ providedIn: 'root' })
export class MailPreferencesApi {
  private readonly http = inject(HttpClient);

  preferences() {
    return httpResource<MailPreferenceDto[]>(() => '/api/mail/preferences');
  }

  save(event: MailEvent, enabled: boolean): Promise<MailPreferenceDto[]> {
    return firstValueFrom(
      this.http.put<MailPreferenceDto[]>('/api/mail/preferences', { preferences: { [event]: enabled } }),
    );
  }
}
