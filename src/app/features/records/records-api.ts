import { Injectable, inject, type Signal } from '@angular/core';
import { HttpClient, httpResource } from '@angular/common/http';
import { firstValueFrom } from 'rxjs';
import type { Page } from '../../../../shared/schemas/common.schema';
import type { OUTBOX_EVENTS, SentMailDto } from '../../../../shared/schemas/mail.schema';
import type { PackVerification, VerifyResult } from '../../../../shared/schemas/verify.schema';

export interface SentMailParams {
  page: number;
  size: number;
  status: '' | SentMailDto['status'];
  event: '' | (typeof OUTBOX_EVENTS)[number];
}

/** Server state of the record pages: hash look-ups, pack checks and the sent-mail outbox. */
@Injectable({ providedIn: 'root' })
export class RecordsApi {
  private readonly http = inject(HttpClient);

  verify(hash: Signal<string | undefined>) {
    return httpResource<VerifyResult>(() => (hash() ? `/api/verify/${encodeURIComponent(hash()!)}` : undefined));
  }

  verifyPack(file: File): Promise<PackVerification> {
    const form = new FormData();
    form.append('file', file, file.name);
    return firstValueFrom(this.http.post<PackVerification>('/api/verify/pack', form));
  }

  sentMail(params: Signal<SentMailParams>) {
    return httpResource<Page<SentMailDto>>(() => {
      const { status, event, ...rest } = params();
      return { url: '/api/mail/sent', params: { ...rest, ...(status ? { status } : {}), ...(event ? { event } : {}) } };
    });
  }

  sentMailOne(id: number): Promise<SentMailDto> {
    return firstValueFrom(this.http.get<SentMailDto>(`/api/mail/sent/${id}`));
  }
}
