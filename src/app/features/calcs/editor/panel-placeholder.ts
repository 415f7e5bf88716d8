import { ChangeDetectionStrategy, Component, ElementRef, inject, input } from '@angular/core';
import { PanelPacer } from './panel-pacer';

/*
 * What stands in for a panel of the workbench until it is built: its heading, at about its height so nothing below
 * it jumps. It is a tab stop where the panel's first field will be: reached by keyboard, it builds the panels and
 * hands focus on to that field, so the tab order is the panel's own.
 */
@Component({
  selector: 'tt-panel-placeholder',
  template: `<h2>{{ heading() }}</h2>
    <p class="tt-muted">Preparing the fields…</p>`,
  styles: `
    :host {
      display: block;
      box-sizing: border-box;
      background: #fffdf8;
      border: 1px solid var(--tt-rule);
      border-radius: 6px;
      padding: 12px 16px 8px;
    }
    h2 {
      font: var(--mat-sys-title-medium);
      margin: 0 0 10px;
    }
  `,
  host: {
    tabindex: '0',
    role: 'group',
    '[attr.aria-label]': 'heading()',
    '[style.min-height.px]': 'height()',
    '(focus)': 'buildAndEnter()',
  },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PanelPlaceholder {
  private readonly pacer = inject(PanelPacer);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  readonly heading = input.required<string>();
  /** The built panel's heading id: focus goes to the first field after it. */
  readonly headingId = input.required<string>();
  /** About the built panel's height, in px. */
  readonly height = input(120);

  protected async buildAndEnter(): Promise<void> {
    const heading = await this.pacer.reveal(`#${this.headingId()}`);
    const panel = heading?.closest('section');
    const first = panel?.querySelector<HTMLElement>('input, textarea, button, [tabindex="0"], mat-select');
    if (first && this.host.nativeElement.ownerDocument.activeElement === this.host.nativeElement.ownerDocument.body)
      first.focus();
  }
}
