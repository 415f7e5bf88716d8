import { Injectable, computed, inject, signal } from '@angular/core';
import { HttpClient } from '@angular/common/http';
import { PureAbility } from '@casl/ability';
import { firstValueFrom } from 'rxjs';
import type { AppAbility, AppRawRule } from '../../../../shared/authz/app-ability';
import type { LoginRequest, SessionUser } from '../../../../shared/schemas/auth.schema';

interface SessionResponse {
  user: SessionUser | null;
  rules: AppRawRule[];
  csrfToken: string;
  organisation?: string;
}

/**
 * Who is signed in, their rules and the CSRF token, as signals. The server decides every
 * permission; the rules here only decide what the client shows.
 */
@Injectable({ providedIn: 'root' })
export class SessionStore {
  private readonly http = inject(HttpClient);
  private readonly ability = inject<AppAbility>(PureAbility);
  private readonly state = signal<SessionResponse>({ user: null, rules: [], csrfToken: '' });

  readonly user = computed(() => this.state().user);
  readonly isSignedIn = computed(() => this.state().user !== null);
  readonly csrfToken = computed(() => this.state().csrfToken);
  readonly organisation = computed(() => this.state().organisation ?? '');

  async load(): Promise<void> {
    try {
      this.apply(await firstValueFrom(this.http.get<SessionResponse>('/api/session')));
    } catch {
      this.apply({ user: null, rules: [], csrfToken: '' });
    }
  }

  async signIn(credentials: LoginRequest): Promise<SessionUser> {
    if (!this.csrfToken()) await this.load();
    const response = await firstValueFrom(this.http.post<SessionResponse>('/api/auth/login', credentials));
    this.apply(response);
    return response.user!;
  }

  async signOut(): Promise<void> {
    try {
      await firstValueFrom(this.http.post('/api/auth/logout', {}));
    } finally {
      this.apply({ user: null, rules: [], csrfToken: '' });
      await this.load();
    }
  }

  /** Called when the server says the session has ended (401 on a signed-in page). */
  expire(): void {
    this.apply({ ...this.state(), user: null, rules: [] });
  }

  private apply(response: SessionResponse): void {
    this.state.set(response);
    this.ability.update(response.rules);
  }
}
