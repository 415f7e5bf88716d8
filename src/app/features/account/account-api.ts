import { Injectable, inject } from '@angular/core';
import { HttpClient, httpResource } from '@angular/common/http';
import { firstValueFrom } from 'rxjs';
import type { SecondFactorEnrolment, SecondFactorStatus } from '../../../../shared/schemas/second-factor.schema';

/** The signed-in person's own credentials: their password and the one-time code asked at signing. */
@Injectable({ providedIn: 'root' })
export class AccountApi {
  private readonly http = inject(HttpClient);

  changePassword(currentPassword: string, newPassword: string): Promise<unknown> {
    return firstValueFrom(this.http.post('/api/auth/password', { currentPassword, newPassword }));
  }

  /** Whether a one-time code is set up (and whether an administrator requires one). */
  secondFactor() {
    return httpResource<SecondFactorStatus>(() => '/api/auth/second-factor');
  }

  beginSecondFactor(): Promise<SecondFactorEnrolment> {
    return firstValueFrom(this.http.post<SecondFactorEnrolment>('/api/auth/second-factor/begin', {}));
  }

  confirmSecondFactor(code: string): Promise<SecondFactorStatus> {
    return firstValueFrom(this.http.post<SecondFactorStatus>('/api/auth/second-factor/confirm', { code }));
  }

  disableSecondFactor(password: string): Promise<SecondFactorStatus> {
    return firstValueFrom(this.http.post<SecondFactorStatus>('/api/auth/second-factor/disable', { password }));
  }
}
