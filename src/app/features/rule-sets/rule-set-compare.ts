import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { LoadFailure } from '../../ui/load-failure';
import { RuleSetsApi } from './rule-sets-api';

const toNumber = (v: unknown) => Number(v ?? 0);

/** Two versions side by side: identity, methods, parameter by parameter, clause by clause. */
@Component({
  selector: 'tt-rule-set-compare',
  imports: [RouterLink, MatProgressBarModule, LoadFailure],
  templateUrl: './rule-set-compare.html',
  styleUrl: './rule-set-compare.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class RuleSetCompare {
  readonly from = input(0, { transform: toNumber });
  readonly to = input(0, { transform: toNumber });
  protected readonly diff = inject(RuleSetsApi).diff(this.from, this.to);
  protected readonly result = computed(() => (this.diff.hasValue() ? this.diff.value() : undefined));
  protected readonly changes = computed(() => this.result()?.changes);
  protected readonly changedClauses = computed(() =>
    (this.changes()?.clauses ?? []).filter((c) => c.change !== 'unchanged'),
  );
  protected readonly changedParameters = computed(() =>
    (this.changes()?.parameters ?? []).filter((p) => p.change !== 'unchanged'),
  );
  protected readonly changedManual = computed(() =>
    (this.changes()?.manualItems ?? []).filter((m) => m.change !== 'unchanged'),
  );
  protected readonly unchangedClauses = computed(
    () => (this.changes()?.clauses ?? []).filter((c) => c.change === 'unchanged').length,
  );

  /** Dimensionless parameters carry the unit "1", which reads as a stray digit: leave it out. */
  protected withUnit(value: unknown, unit: string | undefined): string {
    return unit && unit !== '1' ? `${this.show(value)} ${unit}` : this.show(value);
  }

  protected show(v: unknown): string {
    return typeof v === 'string' ? v : JSON.stringify(v);
  }
}
