import { ChangeDetectionStrategy, Component, effect, inject, output, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import {
  HEALTH_SETTING_FIELDS,
  type HealthSettingKey,
  type HealthSettings,
} from '../../../../shared/schemas/review-health.schema';
import { assertApiFailure } from '../../core/http/api-failure';
import { LoadFailure } from '../../ui/load-failure';
import { ReviewHealthApi } from './review-health-api';

type SettingsForm = { [K in HealthSettingKey]: FormControl<number | null> };
const KEYS = Object.keys(HEALTH_SETTING_FIELDS) as HealthSettingKey[];

/** The organisation's thresholds, editable by compliance and administrators; every change is on the audit trail. */
@Component({
  selector: 'tt-health-settings-panel',
  imports: [LoadFailure, DatePipe, ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatInputModule],
  templateUrl: './health-settings-panel.html',
  styleUrl: './health-settings-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HealthSettingsPanel {
  private readonly api = inject(ReviewHealthApi);
  readonly saved = output<void>();
  protected readonly settings = this.api.settings();
  protected readonly fields = KEYS.map((key) => ({ key, ...HEALTH_SETTING_FIELDS[key] }));
  protected readonly form = new FormGroup<SettingsForm>(
    Object.fromEntries(
      KEYS.map((k) => [
        k,
        new FormControl<number | null>(null, [
          Validators.required,
          Validators.min(HEALTH_SETTING_FIELDS[k].min),
          Validators.max(HEALTH_SETTING_FIELDS[k].max),
          Validators.pattern(/^\d+$/),
        ]),
      ]),
    ) as SettingsForm,
  );
  protected readonly isSaving = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);

  constructor() {
    // Closed until the stored values arrive: a value typed sooner would be overwritten by them without a word.
    this.form.disable();
    effect(() => {
      if (!this.settings.hasValue()) return;
      this.form.reset(this.pick(this.settings.value()));
      this.form.enable();
    });
  }

  protected errorOf(key: HealthSettingKey): string {
    const c = this.form.controls[key];
    const { label, min, max } = HEALTH_SETTING_FIELDS[key];
    if (c.hasError('server')) return c.getError('server') as string;
    return `${label}: enter a whole number from ${min} to ${max}`;
  }

  protected async save(): Promise<void> {
    if (this.form.invalid || !this.settings.hasValue()) return this.form.markAllAsTouched();
    this.isSaving.set(true);
    this.problem.set(null);
    this.notice.set(null);
    try {
      const values = this.form.getRawValue() as HealthSettings;
      const stored = await this.api.saveSettings({ ...values, lockVersion: this.settings.value().lockVersion });
      this.settings.set(stored);
      this.notice.set('Thresholds saved; the change is on the audit trail.');
      this.saved.emit();
    } catch (error) {
      this.showFailure(error);
    } finally {
      this.isSaving.set(false);
    }
  }

  private showFailure(error: unknown): void {
    assertApiFailure(error);
    const failure = error;
    for (const [field, reasons] of Object.entries(failure.fieldErrors)) {
      const control = this.form.controls[field as HealthSettingKey];
      if (control) control.setErrors({ server: reasons.join('; ') });
    }
    this.problem.set(failure.status === 409 ? `${failure.message}.` : failure.message);
    if (failure.status === 409) this.settings.reload();
  }

  private pick(s: HealthSettings): HealthSettings {
    return Object.fromEntries(KEYS.map((k) => [k, s[k]])) as HealthSettings;
  }
}
