import { Injectable, computed, inject, signal, type Signal } from '@angular/core';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import type { IndependentModelDto } from '../../../../../shared/schemas/independent-model.schema';
import { SessionStore } from '../../../core/auth/session-store';
import { assertApiFailure } from '../../../core/http/api-failure';
import { IndependentModelApi } from '../calc-page/independent-model-api';
import { canonical } from '../editor/editor-support';

/**
 * The checker's stored draft of their independent model: read (only when it is theirs, or locked and theirs to
 * see), saved with its version (a stale one is a 409 and never overwrites), and locked as a separate step.
 * Provided per page, so it resets when the checker leaves.
 */
@Injectable()
export class ModelDraft {
  private readonly api = inject(IndependentModelApi);
  private readonly me = inject(SessionStore).user;
  private readonly revision = signal<RevisionDto | null>(null);

  private readonly readableId = computed(() => {
    const r = this.revision();
    const m = r?.verification?.model;
    if (!r || !m) return undefined;
    return m.checker.id === this.me()?.id || (m.state === 'locked' && !r.verification!.blind) ? r.id : undefined;
  });
  readonly read = this.api.model(this.readableId);
  readonly model: Signal<IndependentModelDto | null> = computed(() =>
    this.read.hasValue() ? this.read.value() : null,
  );
  /** Someone else's model, or a model this reader may not read yet: nothing to load, nothing to build. */
  readonly isOthers = computed(() => {
    const m = this.revision()?.verification?.model;
    return !!m && m.checker.id !== this.me()?.id;
  });
  readonly isLocked = computed(() => this.revision()?.verification?.model?.state === 'locked');
  /** Ready once there is nothing to read, or the read has answered. */
  readonly isReady = computed(() => !!this.revision() && (this.readableId() === undefined || this.read.hasValue()));
  /** Canonical input as stored; anything else on screen is an unsaved change. */
  readonly baseline = signal<string | null>(null);
  readonly isSaving = signal(false);
  readonly message = signal<string | null>(null);
  readonly conflict = signal<number | null>(null);

  follow(revision: RevisionDto | null): void {
    this.revision.set(revision);
  }

  async save(input: Record<string, unknown>): Promise<boolean> {
    const r = this.revision();
    if (!r) return false;
    this.isSaving.set(true);
    this.message.set(null);
    try {
      const saved = await this.api.save(r.id, input, this.model()?.lockVersion ?? 0);
      this.read.set(saved);
      this.baseline.set(canonical(input));
      this.conflict.set(null);
      return true;
    } catch (error) {
      assertApiFailure(error);
      if (error.status === 409) this.conflict.set(this.model()?.lockVersion ?? 0);
      this.message.set([error.message, ...(Object.keys(error.fieldErrors).length ? error.lines() : [])].join(' — '));
      return false;
    } finally {
      this.isSaving.set(false);
    }
  }

  async lock(): Promise<boolean> {
    const r = this.revision();
    const m = this.model();
    if (!r || !m) return false;
    this.message.set(null);
    try {
      this.read.set(await this.api.lock(r.id, m.lockVersion));
      return true;
    } catch (error) {
      assertApiFailure(error);
      this.message.set(error.lines().join('; '));
      return false;
    }
  }
}
