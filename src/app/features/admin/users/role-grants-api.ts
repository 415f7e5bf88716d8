import { Injectable, inject } from '@angular/core';
import { HttpClient, httpResource } from '@angular/common/http';
import { firstValueFrom } from 'rxjs';
import { roleGrantListSchema, type RoleGrantDto } from '../../../../../shared/schemas/role-grant.schema';

/** Signing roles waiting for a second person, and that person's decision. */
@Injectable({ providedIn: 'root' })
export class RoleGrantsApi {
  private readonly http = inject(HttpClient);

  pending() {
    return httpResource<RoleGrantDto[]>(() => '/api/role-grants', {
      parse: (raw) => roleGrantListSchema.parse(raw) as RoleGrantDto[],
    });
  }

  confirm(id: number, password: string): Promise<RoleGrantDto> {
    return firstValueFrom(this.http.post<RoleGrantDto>(`/api/role-grants/${id}/confirm`, { password }));
  }

  refuse(id: number, reason: string): Promise<RoleGrantDto> {
    return firstValueFrom(this.http.post<RoleGrantDto>(`/api/role-grants/${id}/refuse`, { reason }));
  }
}
