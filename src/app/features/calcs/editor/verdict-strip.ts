import { ChangeDetectionStrategy, Component, DOCUMENT, computed, inject, input } from '@angular/core';
import type { Checklist, ChecklistRow } from '../../../../../shared/rules';
import type { ChecklistState } from './live-calc';
import { PanelPacer } from './panel-pacer';

/** The checklist stored with the revision, shown until the live one (same input, same engine) is ready. */
export interface StoredChecklist {
  kind: 'stored';
  checklist: Checklist;
}

interface Failing {
  key: string;
  text: string;
  advisory: boolean;
}

/**
 * The live verdict and the clauses that fail, kept in view (sticky) while the author edits, so a
 * change that breaks a clause is seen at once rather than 3000 px further down. Advisory failures
 * are told apart from mandatory ones in words as well as colour. The strip keeps one height from the
 * first render, verdict or not, however many clauses fail: the form below it never moves when a verdict
 * arrives or changes, so a click made at that moment lands where it was aimed (verdict-strip.scss).
 */
@Component({
  selector: 'tt-verdict-strip',
  templateUrl: './verdict-strip.html',
  styleUrl: './verdict-strip.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VerdictStrip {
  private readonly document = inject(DOCUMENT);
  private readonly pacer = inject(PanelPacer, { optional: true });
  readonly state = input.required<ChecklistState | StoredChecklist>();

  protected readonly failing = computed((): Failing[] => {
    const s = this.state();
    if (s.kind !== 'ready' && s.kind !== 'stored') return [];
    return s.checklist.rows
      .filter((r) => r.status === 'fail' || r.status === 'error')
      .sort((a, b) => Number(a.severity === 'advisory') - Number(b.severity === 'advisory'))
      .map((r, i) => ({ key: `${r.clauseId}-${i}`, text: rowText(r), advisory: r.severity === 'advisory' }));
  });
  protected readonly mandatory = computed(() => this.failing().filter((f) => !f.advisory));
  protected readonly advisory = computed(() => this.failing().filter((f) => f.advisory));

  protected async toChecklist(): Promise<void> {
    // The checklist is built after the fields; asked for, it is built now.
    const heading = this.document.getElementById('checklist-h') ?? (await this.pacer?.reveal('#checklist-h'));
    heading?.scrollIntoView({ block: 'start' });
  }
}

function rowText(r: ChecklistRow): string {
  return `§${r.clauseId} ${r.clauseTitle}, ${r.location.label}`;
}
