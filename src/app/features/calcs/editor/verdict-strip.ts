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
 * are told apart from mandatory ones in words as well as colour.
 */
@Component({
  selector: 'tt-verdict-strip',
  template: `
    @let s = state();
    @if (s.kind === 'ready' || s.kind === 'stored') {
      @let c = s.checklist;
      <div class="strip" [attr.data-verdict]="c.verdict" role="status" aria-live="polite">
        <strong class="head"
          >{{ c.verdict === 'compliant' ? '✓ Meets' : '✗ Does not meet' }} {{ c.ruleSet.code }} v{{
            c.ruleSet.version
          }}</strong
        >
        @if (mandatory().length) {
          <span class="count bad">{{ mandatory().length }} mandatory failing</span>
        }
        @if (advisory().length) {
          <span class="count adv">{{ advisory().length }} advisory not met</span>
        }
        <button type="button" class="link" (click)="toChecklist()">Checklist</button>
        @if (failing().length) {
          <ul class="rows" tabindex="0" aria-label="Failing clause rows">
            @for (f of failing(); track f.key) {
              <li [class.adv]="f.advisory">{{ f.advisory ? 'advisory' : 'mandatory' }} · {{ f.text }}</li>
            }
          </ul>
        }
      </div>
    }
  `,
  styles: `
    :host {
      display: block;
      position: sticky;
      top: 0;
      z-index: 5;
    }
    .strip {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 4px 12px;
      padding: 6px 12px;
      margin: 0 0 12px;
      background: #eef6f0;
      border: 1px solid #b9d8c4;
      border-left: 5px solid var(--tt-pass);
      border-radius: 4px;
      box-shadow: 0 2px 6px rgb(0 0 0 / 8%);
      &[data-verdict='not-compliant'] {
        background: #fbefed;
        border-color: #e8c4be;
        border-left-color: var(--tt-fail);
      }
    }
    .head {
      font-size: 14px;
    }
    [data-verdict='compliant'] .head {
      color: var(--tt-pass);
    }
    [data-verdict='not-compliant'] .head {
      color: var(--tt-fail);
    }
    .count {
      font-size: 12px;
      font-weight: 600;
      padding: 1px 6px;
      border-radius: 3px;
    }
    .bad {
      color: #fff;
      background: var(--tt-fail);
    }
    .adv {
      color: var(--tt-warn);
    }
    .count.adv {
      background: #fdf1d8;
    }
    .link {
      background: none;
      border: 0;
      padding: 0;
      font: inherit;
      font-size: 13px;
      text-decoration: underline;
      cursor: pointer;
      color: var(--tt-ink);
      margin-left: auto;
    }
    .rows {
      flex-basis: 100%;
      margin: 2px 0 0;
      padding-left: 18px;
      font-size: 12.5px;
      max-height: 7.5em;
      overflow-y: auto;
      color: var(--tt-fail);
    }
    .rows li.adv {
      color: var(--tt-warn);
    }
    @media (max-width: 700px) {
      .rows {
        max-height: 4.6em;
      }
    }
  `,
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
