import { Injectable, inject, signal } from '@angular/core';
import type { AuditChainStatus } from '../../../../shared/schemas/audit.schema';
import { assertApiFailure } from '../../core/http/api-failure';
import { AuditApi } from './audit-api';

/** Verifying the audit trail's hash chain on request: the last answer, a failure's message, and whether it runs. */
@Injectable()
export class ChainCheck {
  private readonly api = inject(AuditApi);
  private readonly statusSignal = signal<AuditChainStatus | null>(null);
  private readonly errorSignal = signal<string | null>(null);
  private readonly runningSignal = signal(false);
  readonly status = this.statusSignal.asReadonly();
  readonly error = this.errorSignal.asReadonly();
  readonly isRunning = this.runningSignal.asReadonly();

  async verify(): Promise<void> {
    this.runningSignal.set(true);
    this.errorSignal.set(null);
    try {
      this.statusSignal.set(await this.api.verifyChain());
    } catch (error) {
      assertApiFailure(error);
      this.errorSignal.set(error.message);
    } finally {
      this.runningSignal.set(false);
    }
  }
}
