import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { STATE_LABELS, type RevisionState } from '../../../shared/schemas/revision.schema';

/** A revision's workflow state as a small, shape-and-text badge (never colour alone). */
@Component({
  selector: 'tt-state-badge',
  template: `<span class="badge" [attr.data-state]="state()"><span class="mark" aria-hidden="true">{{ mark() }}</span>{{ label() }}</span>`,
  styles: `
    .badge { display: inline-flex; align-items: center; gap: 5px; padding: 2px 8px 2px 6px; border-radius: 3px;
             font-size: 12px; font-weight: 500; border: 1px solid currentColor; white-space: nowrap; }
    .mark { font-family: var(--tt-mono); font-size: 11px; }
    [data-state='draft'] { color: #4d5c5f; background: #eef0ee; }
    [data-state='in_check'] { color: #7a4a00; background: #fbf0dc; }
    [data-state='returned'] { color: #8a2318; background: #f8e4e0; }
    [data-state='checked'] { color: #1d4852; background: #e0eef0; }
    [data-state='approved'] { color: #1b5e3d; background: #dff0e6; }
    [data-state='superseded'], [data-state='withdrawn'] { color: #5b5b5b; background: #efedea; text-decoration: line-through; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StateBadge {
  readonly state = input.required<RevisionState>();
  protected readonly label = computed(() => STATE_LABELS[this.state()]);
  protected readonly mark = computed(() => ({ draft: '✎', in_check: '◔', returned: '↩', checked: '◑', approved: '●', superseded: '○', withdrawn: '×' })[this.state()]);
}
