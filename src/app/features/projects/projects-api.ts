import { Injectable, inject, type Signal } from '@angular/core';
import { HttpClient, httpResource } from '@angular/common/http';
import { firstValueFrom } from 'rxjs';
import type { Page } from '../../../../shared/schemas/common.schema';
import type { CreateProjectRequest, ProjectDto, UpdateProjectRequest } from '../../../../shared/schemas/project.schema';

export interface ProjectListParams {
  page: number;
  size: number;
  q: string;
}

@Injectable({ providedIn: 'root' })
export class ProjectsApi {
  private readonly http = inject(HttpClient);

  /** Server-side paging: the params signal drives the request. */
  list(params: Signal<ProjectListParams>) {
    return httpResource<Page<ProjectDto>>(() => ({
      url: '/api/projects',
      params: { page: params().page, size: params().size, ...(params().q ? { q: params().q } : {}) },
    }));
  }

  /** One project by id; no request while the id is null. */
  one(id: Signal<number | null>) {
    return httpResource<ProjectDto>(() => (id() === null ? undefined : `/api/projects/${id()}`));
  }

  create(dto: CreateProjectRequest): Promise<ProjectDto> {
    return firstValueFrom(this.http.post<ProjectDto>('/api/projects', dto));
  }

  update(id: number, dto: UpdateProjectRequest): Promise<ProjectDto> {
    return firstValueFrom(this.http.patch<ProjectDto>(`/api/projects/${id}`, dto));
  }
}
