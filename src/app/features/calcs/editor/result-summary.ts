import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { CalcResult, Extreme } from '../../../../../shared/engine';
import { beamUnit, featureTag, hasBeamModel } from '../../../../../shared/plots';
import { fmt, type CriterionKey } from './result-format';

interface Figure { label: string; value: string; unit: string; where: string }

/** The few numbers an engineer looks at first: largest shear, total twist, lowest safety factors. */
@Component({
  selector: 'tt-result-summary',
  template: `
    <dl class="figures">
      @for (f of figures(); track f.label) {
        <div class="figure"><dt>{{ f.label }}</dt><dd><span class="value tt-mono">{{ f.value }}</span> <span class="unit">{{ f.unit }}</span><span class="where">{{ f.where }}</span></dd></div>
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

  private where(e: Extreme | null): string {
    if (!e) return 'no loaded section';
    const r = this.result();
    const at = `${fmt(e.at)} ${r.fields['at']?.unit ?? ''}`;
    if (e.where === 'feature') {
      const f = r.features[e.index];
      return f ? `${featureTag(f.type as Parameters<typeof featureTag>[0], f.index)} at ${at}` : `at ${at}`;
    }
    return `segment ${e.index + 1} at ${at}`;
  }

  protected readonly figures = computed((): Figure[] => {
    const r = this.result();
    const len = r.fields['at']?.unit ?? '';
    const out: Figure[] = [
      { label: 'Largest shear τmax', value: fmt(r.maxShear.value), unit: r.fields['tauMax']?.unit ?? '', where: `segment ${r.maxShear.segment + 1} at ${fmt(r.maxShear.at)} ${len}` },
      { label: 'Total twist φ', value: fmt(r.twistTotal), unit: r.fields['twistTotal']?.unit ?? '', where: `over ${fmt(r.length)} ${len}` },
      { label: 'Lowest yield safety', value: fmt(r.minYieldSafety?.value, 3), unit: '', where: this.where(r.minYieldSafety) },
    ];
    if (r.minFatigueSafety) {
      const e = r.minFatigueSafety[this.criterion()];
      out.push({ label: 'Lowest fatigue safety', value: fmt(e?.value, 3), unit: '', where: `${this.criterionName()}, ${this.where(e)}` });
    }
    if (hasBeamModel(r)) {
      const c = r.criticalSpeed;
      out.push({ label: 'Largest deflection δ', value: fmt(r.deflection?.max, 3), unit: beamUnit(r, 'deflection'), where: `at ${fmt(r.deflection?.at)} ${len}` });
      out.push({ label: 'Critical / operating speed', value: fmt(c?.ratio, 3), unit: '', where: c ? `first critical ${fmt(c.rpm)} rpm` : 'not computed' });
    }
    return out;
  });
}
