import { HttpClient, HttpHeaders, HttpInterceptorFn, HttpResponse } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { concatMap, firstValueFrom, from, of } from 'rxjs';
import type { EngineMetadata } from '../../../../shared/engine/stored-result';
import {
  REVISION_FORM_HEADER,
  STORED_FORM,
  STORED_FORM_PATH,
  STORED_FORM_SAVE_PATH,
  expandRevision,
  metadataVersionOf,
  type StoredRevisionDto,
} from '../../../../shared/schemas/revision-form';

/** The path of a request URL, without its query. */
const pathOf = (url: string) => url.split('?')[0];

/** Whether a GET of this URL is answered in the stored form when asked (one revision, a calc's newest). */
export const readsStoredForm = (url: string) => STORED_FORM_PATH.test(pathOf(url));

/** Whether this request's answer may come in the stored form: those reads, and a save (PUT) of a revision. */
const answersStoredForm = (method: string, url: string) =>
  method === 'GET' ? readsStoredForm(url) : method === 'PUT' && STORED_FORM_SAVE_PATH.test(pathOf(url));

/** The header that asks for it: the route prefetch's early reads carry it too, so the page can adopt them. */
export const STORED_FORM_HEADERS = new HttpHeaders({ [REVISION_FORM_HEADER]: STORED_FORM });

/**
 * Each engine version's units and formulas, read once (and kept by the browser: the server marks them immutable).
 * A failed read is forgotten, so the next revision shown asks again.
 */
@Injectable({ providedIn: 'root' })
export class EngineMetadataStore {
  private readonly http = inject(HttpClient);
  private readonly known = new Map<string, Promise<EngineMetadata>>();

  of(version: string): Promise<EngineMetadata> {
    let found = this.known.get(version);
    if (!found) {
      found = firstValueFrom(this.http.get<EngineMetadata>(`/api/engine-metadata/${encodeURIComponent(version)}`));
      found.catch(() => this.known.delete(version));
      this.known.set(version, found);
    }
    return found;
  }

  /** A revision read as the full form gives it (a read already in full passes unchanged). */
  async expand(read: StoredRevisionDto): Promise<unknown> {
    const version = metadataVersionOf(read);
    return expandRevision(read, version === null ? null : await this.of(version));
  }
}

/**
 * Reads a revision (and takes a save's answer) with its result and checklist as stored (about half the bytes, nothing
 * for the server to build again) and expands them here with the engine version's units and formulas
 * (shared/schemas/revision-form.ts), so every screen receives the revision exactly as the full answer would give it.
 */
export const revisionFormInterceptor: HttpInterceptorFn = (req, next) => {
  if (!answersStoredForm(req.method, req.url)) return next(req);
  const store = inject(EngineMetadataStore);
  return next(req.clone({ setHeaders: { [REVISION_FORM_HEADER]: STORED_FORM } })).pipe(
    concatMap((event) =>
      event instanceof HttpResponse && event.body
        ? from(store.expand(event.body as StoredRevisionDto).then((body) => event.clone({ body })))
        : of(event),
    ),
  );
};
