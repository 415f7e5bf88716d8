import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { Router } from '@angular/router';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { PackVerification } from '../../../../shared/schemas/verify.schema';
import { STATE_LABELS, type RevisionState } from '../../../../shared/schemas/revision.schema';
import { assertApiFailure } from '../../core/http/api-failure';
import { LoadFailure } from '../../ui/load-failure';
import { SafetyNote } from '../../ui/safety-note';
import { RecordsApi } from './records-api';

const HASH = /^[0-9a-fA-F\s]{64,80}$/;

/** Anyone signed in checks a printed record hash (or a scanned QR code), or a whole evidence pack. */
@Component({
  selector: 'tt-verify-page',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatIconModule,
    MatProgressBarModule,
    LoadFailure,
    SafetyNote,
  ],
  templateUrl: './verify-page.html',
  styleUrl: './verify-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class VerifyPage {
  private readonly api = inject(RecordsApi);
  private readonly router = inject(Router);

  readonly hash = input<string | undefined>(undefined);
  protected readonly form = inject(NonNullableFormBuilder).group({
    hash: ['', [Validators.required, Validators.pattern(HASH)]],
  });
  protected readonly result = this.api.verify(this.hash);
  protected readonly pack = signal<PackVerification | null>(null);
  protected readonly packError = signal<string | null>(null);
  protected readonly isChecking = signal(false);
  protected readonly failedChecks = computed(() => this.pack()?.checks.filter((c) => !c.ok) ?? []);

  protected stateLabel(state: string): string {
    return STATE_LABELS[state as RevisionState] ?? state;
  }

  protected lookUp(): void {
    if (this.form.invalid) return this.form.markAllAsTouched();
    void this.router.navigate(['/verify', this.form.getRawValue().hash.replace(/\s+/g, '').toLowerCase()]);
  }

  protected async checkPack(files: FileList | null): Promise<void> {
    const file = files?.item(0);
    if (!file) return;
    this.isChecking.set(true);
    this.pack.set(null);
    this.packError.set(null);
    try {
      this.pack.set(await this.api.verifyPack(file));
    } catch (error) {
      assertApiFailure(error);
      this.packError.set(error.fieldErrors['file']?.[0] ? `The file ${error.fieldErrors['file'][0]}` : error.message);
    } finally {
      this.isChecking.set(false);
    }
  }
}
