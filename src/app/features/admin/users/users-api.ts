import { Injectable, inject, type Signal } from '@angular/core';
import { HttpClient, httpResource } from '@angular/common/http';
import { firstValueFrom } from 'rxjs';
import type { Page } from '../../../../../shared/schemas/common.schema';
import type { CreateUserRequest, UpdateUserRequest, UserDto } from '../../../../../shared/schemas/user.schema';

export interface UserListParams {
  page: number;
  size: number;
  q: string;
}

@Injectable({ providedIn: 'root' })
export class UsersApi {
  private readonly http = inject(HttpClient);

  list(params: Signal<UserListParams>) {
    return httpResource<Page<UserDto>>(() => ({
      url: '/api/users',
      params: { page: params().page, size: params().size, ...(params().q ? { q: params().q } : {}) },
    }));
  }

  create(dto: CreateUserRequest): Promise<UserDto> {
    return firstValueFrom(this.http.post<UserDto>('/api/users', dto));
  }

  update(id: number, dto: UpdateUserRequest): Promise<UserDto> {
    return firstValueFrom(this.http.patch<UserDto>(`/api/users/${id}`, dto));
  }

  setActive(id: number, active: boolean): Promise<UserDto> {
    return firstValueFrom(this.http.put<UserDto>(`/api/users/${id}/active`, { active }));
  }
}
