import { Injectable, inject, type Signal } from '@angular/core';
import { HttpClient, httpResource } from '@angular/common/http';
import { firstValueFrom } from 'rxjs';
import type { AttachmentDto, AttachmentKind, AttachmentListDto } from '../../../../../shared/schemas/attachment.schema';

/** The files of one revision: list, upload (multipart), remove. Downloads are plain links. */
@Injectable({ providedIn: 'root' })
export class AttachmentsApi {
  private readonly http = inject(HttpClient);

  list(revisionId: Signal<number>) {
    return httpResource<AttachmentListDto>(() => `/api/revisions/${revisionId()}/attachments`);
  }

  upload(revisionId: number, file: File, kind: AttachmentKind, note: string): Promise<AttachmentDto> {
    const form = new FormData();
    form.append('kind', kind);
    if (note) form.append('note', note);
    form.append('file', file, file.name);
    return firstValueFrom(this.http.post<AttachmentDto>(`/api/revisions/${revisionId}/attachments`, form));
  }

  remove(id: number): Promise<void> {
    return firstValueFrom(this.http.delete<void>(`/api/attachments/${id}`));
  }
}
