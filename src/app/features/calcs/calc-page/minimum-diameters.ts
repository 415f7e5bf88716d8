import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { DecimalPipe } from '@angular/common';
import { validateCalcInput } from '../../../../../shared/engine';
import { minimumDiameters, type RuleSet } from '../../../../../shared/rules';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { LoadFailure } from '../../../ui/load-failure';
import { RuleSetsApi } from '../../rule-sets/rule-sets-api';

/**
 * For each segment, the smallest outer diameter (same bore ratio when hollow) that passes every
 * mandatory clause of the revision's standard, holding the rest of the shaft as it is. Computed
 * in the browser with the shared engine and rule set, so it always matches the checklist.
 */
@Component({
  selector: 'tt-minimum-diameters',
  imports: [DecimalPipe, LoadFailure],
  template: `
    @if (rows(); as list) {
      <table class="mins">
        <caption>
          Smallest outer diameter per segment that meets every mandatory clause of
          {{
            revision().ruleSet.code
          }}
          v{{
            revision().ruleSet.version
          }}
        </caption>
        <thead>
          <tr>
            <th>Segment</th>
            <th class="num">Actual od</th>
            <th class="num">Minimum od</th>
            <th>Governing clause</th>
          </tr>
        </thead>
        <tbody>
          @for (m of list; track m.index) {
            <tr [class.under]="m.minimum !== null && m.minimum > m.actual">
              <td>{{ m.index + 1 }} {{ m.label }}</td>
              <td class="num tt-mono">{{ m.actual | number: '1.0-2' }} {{ unit() }}</td>
              <td class="num tt-mono">{{ m.minimum === null ? '—' : (m.minimum | number: '1.0-2') + ' ' + unit() }}</td>
              <td>{{ m.note }}</td>
            </tr>
          }
        </tbody>
      </table>
    } @else if (ruleSet.error(); as error) {
      <tt-load-failure [error]="error" what="standard's text for minimum diameters" (retry)="ruleSet.reload()" />
    } @else {
      <p class="tt-muted">
        Minimum diameters need valid input and the standard's text; they appear once both are loaded.
      </p>
    }
  `,
  styles: `
    .mins {
      width: 100%;
      border-collapse: collapse;
      font-size: 13px;
    }
    caption {
      text-align: left;
      font-weight: 500;
      padding: 0 0 6px;
    }
    th,
    td {
      text-align: left;
      padding: 5px 8px;
      border-bottom: 1px solid var(--tt-rule);
    }
    .num {
      text-align: right;
    }
    tr.under td {
      background: #fbefed;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MinimumDiameters {
  readonly revision = input.required<RevisionDto>();
  protected readonly ruleSet = inject(RuleSetsApi).one(computed(() => this.revision().ruleSet.id));
  protected readonly unit = computed(() =>
    (this.revision().input as { units?: string }).units === 'US' ? 'in' : 'mm',
  );
  protected readonly rows = computed(() => {
    const doc = (this.ruleSet.hasValue() ? this.ruleSet.value().document : undefined) as RuleSet | undefined;
    const checked = validateCalcInput(this.revision().input);
    if (!doc || !checked.ok) return null;
    return minimumDiameters(checked.value, doc).map((m) => ({
      index: m.segment,
      label: m.label,
      actual: m.current,
      minimum: m.minimum,
      note: m.governing && m.status === 'found' ? `§${m.governing.clauseId} ${m.governing.clauseTitle}` : m.message,
    }));
  });
}
