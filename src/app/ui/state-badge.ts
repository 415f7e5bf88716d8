import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { RevisionState } from '../../../shared/schemas/revision.schema';
import { WORKFLOW } from '../../../shared/workflow/revision-states';

/**
 * A revision's workflow state as a small, shape-and-text badge (never colour alone); words and glyph from the workflow
 * table.
 */
@Component({
  selector: 'tt-state-badge',
  template: `<span class="badge" [attr.data-state]="state()" [attr.data-tone]="badge().tone"
    ><span class="mark" aria-hidden="true">{{ badge().glyph }}</span
    >{{ label() }}</span
  >`,
  styles: `
    .badge {
      display: inline-flex;
      align-items: center;
      gap: 5px;
      padding: 2px 8px 2px 6px;
      border-radius: 3px;
      font-size: 12px;
      font-weight: 500;
      border: 1px solid currentColor;
      white-space: nowrap;
    }
    .mark {
      font-family: var(--tt-mono);
      font-size: 11px;
    }
    [data-tone='open'] {
      color: #4d5c5f;
      background: #eef0ee;
    }
    [data-tone='waiting'] {
      color: #7a4a00;
      background: #fbf0dc;
    }
    [data-tone='returned'] {
      color: #8a2318;
      background: #f8e4e0;
    }
    [data-tone='checked'] {
      color: #1d4852;
      background: #e0eef0;
    }
    [data-tone='released'] {
      color: #1b5e3d;
      background: #dff0e6;
    }
    [data-tone='closed'] {
      color: #5b5b5b;
      background: #efedea;
      text-decoration: line-through;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StateBadge {
  readonly state = input.required<RevisionState>();
  protected readonly badge = computed(() => WORKFLOW[this.state()].badge);
  protected readonly label = computed(() => WORKFLOW[this.state()].label);
}
