import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import {
  FormControl,
  FormGroup,
  ReactiveFormsModule,
  Validators,
  type AbstractControl,
  type ValidationErrors,
} from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { AbilityServiceSignal } from '@casl/angular';
import type { AppAbility } from '../../../../shared/authz/app-ability';
import { HEALTH_CAUTION } from '../../../../shared/review-health/signal-texts';
import { MAX_PERIOD_DAYS } from '../../../../shared/schemas/review-health.schema';
import { LoadFailure } from '../../ui/load-failure';
import { ProjectPicker } from '../projects/project-picker';
import { ReviewHealthApi, type HealthParams } from './review-health-api';
import { SignalSection } from './signal-section';
import { FindingRates } from './finding-rates';
import { HealthSettingsPanel } from './health-settings-panel';

const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/;
const day = (offsetDays: number) => new Date(Date.now() - offsetDays * 86_400_000).toISOString().slice(0, 10);
const isDay = (v: string) =>
  ISO_DAY.test(v) &&
  !Number.isNaN(Date.parse(`${v}T00:00:00Z`)) &&
  new Date(`${v}T00:00:00Z`).toISOString().startsWith(v);

/** The period must be two real days in order and no longer than the server accepts. */
function periodProblem(group: AbstractControl): ValidationErrors | null {
  const { from, to } = group.value as { from: string; to: string };
  if (!isDay(from) || !isDay(to)) return null;
  if (from > to) return { order: 'From must not be after To' };
  if (Date.parse(to) - Date.parse(from) > MAX_PERIOD_DAYS * 86_400_000)
    return { span: `The period may span at most ${MAX_PERIOD_DAYS} days` };
  return null;
}

/** Review-health signals of a project and period, for compliance: facts with the trail behind them. */
@Component({
  selector: 'tt-review-health-page',
  imports: [
    LoadFailure,
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    ProjectPicker,
    SignalSection,
    FindingRates,
    HealthSettingsPanel,
  ],
  templateUrl: './review-health-page.html',
  styleUrl: './review-health-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class ReviewHealthPage {
  private readonly api = inject(ReviewHealthApi);
  private readonly ability = inject<AbilityServiceSignal<AppAbility>>(AbilityServiceSignal);
  protected readonly filters = new FormGroup(
    {
      projectId: new FormControl<number | null>(null),
      from: new FormControl(day(90), {
        nonNullable: true,
        validators: [Validators.required, (c) => (isDay(c.value) ? null : { day: true })],
      }),
      to: new FormControl(day(0), {
        nonNullable: true,
        validators: [Validators.required, (c) => (isDay(c.value) ? null : { day: true })],
      }),
    },
    { validators: periodProblem },
  );
  private readonly filterValue = toSignal(this.filters.valueChanges, { initialValue: this.filters.getRawValue() });
  /** Only a complete, valid period is asked for; the form shows what is wrong meanwhile. */
  protected readonly params = computed<HealthParams | null>(() => {
    this.filterValue();
    return this.filters.valid ? (this.filters.getRawValue() as HealthParams) : null;
  });
  protected readonly report = this.api.report(this.params);
  protected readonly periodError = computed(() => {
    this.filterValue();
    const e = this.filters.errors;
    return (e?.['order'] ?? e?.['span'] ?? null) as string | null;
  });
  protected readonly csvLink = computed(() => (this.params() ? this.api.csvLink(this.params()!) : null));
  protected readonly canEditSettings = computed(() => this.ability.can('update', 'HealthSettings'));
  protected readonly observations = computed(() =>
    this.report.hasValue() ? this.report.value().signals.reduce((n, s) => n + s.total, 0) : 0,
  );
  protected readonly caution = HEALTH_CAUTION;

  protected reloadReport(): void {
    this.report.reload();
  }
}
