import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { CalcResult, Extreme } from '../../../../../shared/engine';
import type { Checklist, RuleSet } from '../../../../../shared/rules';
import { beamUnit, featureTag, hasBeamModel } from '../../../../../shared/plots';
import { formatEng, headlineMark, unitText, type HeadlineOutcome } from '../../../../../shared/format';
import type { CriterionKey } from './result-format';

interface Figure {
  label: string;
  value: string;
  unit: string;
  where: string;
  outcome: HeadlineOutcome;
  limit: string;
}

const OUTCOME_TEXT: Record<HeadlineOutcome, string> = {
  pass: 'meets',
  fail: 'FAILS',
  'advisory-fail': 'advisory not met',
  unchecked: '',
};

/**
 * The few numbers an engineer looks at first: largest shear, total twist, lowest safety factors.
 * Each is marked by the clause rows that judge it, with its limit and enough digits to show the side.
 */
@Component({
  selector: 'tt-result-summary',
  template: `
    <dl class="figures">
      @for (f of figures(); track f.label) {
        <div class="figure" [attr.data-outcome]="f.outcome">
          <dt>{{ f.label }}</dt>
          <dd>
            <span class="value tt-mono">{{ f.value }}</span>
            @if (f.unit) {
              <span class="unit">{{ f.unit }}</span>
            }
            @if (f.outcome !== 'unchecked') {
              <span class="mark">{{ outcomeText[f.outcome] }} {{ f.limit }}</span>
            }
            <span class="where">{{ f.where }}</span>
          </dd>
        </div>
      }
    </dl>
  `,
  styleUrl: './results.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResultSummary {
  readonly result = input.required<CalcResult>();
  readonly criterion = input<CriterionKey>('goodman');
  readonly criterionName = input('DE-Goodman');
  readonly checklist = input<Checklist | null>(null);
  readonly ruleSet = input<RuleSet | null>(null);
  protected readonly outcomeText = OUTCOME_TEXT;

  private where(e: Extreme | null): string {
    if (!e) return 'no loaded section';
    const r = this.result();
    const at = `${formatEng(e.at)} ${r.fields['at']?.unit ?? ''}`;
    if (e.where === 'feature') {
      const f = r.features[e.index];
      return f ? `${featureTag(f.type as Parameters<typeof featureTag>[0], f.index)} at ${at}` : `at ${at}`;
    }
    return `segment ${e.index + 1} at ${at}`;
  }

  private figure(
    label: string,
    value: number | null | undefined,
    fact: string,
    unit: string,
    where: string,
    sig: number,
  ): Figure {
    const mark = headlineMark(value, fact, this.checklist(), this.ruleSet(), sig);
    return { label, value: mark.text, unit: unitText(unit), where, outcome: mark.outcome, limit: mark.limitText };
  }

  protected readonly figures = computed((): Figure[] => {
    const r = this.result();
    const len = r.fields['at']?.unit ?? '';
    const out: Figure[] = [
      this.figure(
        'Largest shear τmax',
        r.maxShear.value,
        'tauMax',
        r.fields['tauMax']?.unit ?? '',
        `segment ${r.maxShear.segment + 1} at ${formatEng(r.maxShear.at)} ${len}`,
        4,
      ),
      this.figure(
        'Total twist φ',
        r.twistTotal,
        'twistTotal',
        r.fields['twistTotal']?.unit ?? '',
        `over ${formatEng(r.length)} ${len}`,
        4,
      ),
      this.figure('Lowest yield safety', r.minYieldSafety?.value, 'yieldSafety', '1', this.where(r.minYieldSafety), 3),
    ];
    if (r.minFatigueSafety) {
      const e = r.minFatigueSafety[this.criterion()];
      out.push(
        this.figure(
          'Lowest fatigue safety',
          e?.value,
          'fatigueSafety',
          '1',
          `${this.criterionName()}, ${this.where(e)}`,
          3,
        ),
      );
    }
    if (hasBeamModel(r)) {
      const c = r.criticalSpeed;
      out.push(
        this.figure(
          'Largest deflection δ',
          r.deflection?.max,
          'maxDeflection',
          beamUnit(r, 'deflection'),
          `at ${formatEng(r.deflection?.at)} ${len}`,
          3,
        ),
      );
      out.push(
        this.figure(
          'Critical / operating speed',
          c?.ratio,
          'criticalSpeedRatio',
          '1',
          c ? `first critical ${formatEng(c.rpm)} rpm` : 'not computed',
          3,
        ),
      );
    }
    return out;
  });
}
