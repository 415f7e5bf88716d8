import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { SafetyNote } from '../../../ui/safety-note';

/** The whole-shaft model's assumptions beside its results, with the caution. */
@Component({
  selector: 'tt-model-assumptions',
  imports: [SafetyNote],
  template: `
    <section class="assumptions" aria-labelledby="assumptions-h">
      <h3 id="assumptions-h">What this model assumes</h3>
      <ul>
        @for (a of sentences(); track a) {
          <li>{{ a }}</li>
        }
      </ul>
      @if (methods().length) {
        <p class="methods">
          Methods:
          @for (m of methods(); track m; let last = $last) {
            {{ m }}
            @if (!last) {
              ·
            }
          }
        </p>
      }
      <tt-safety-note compact />
    </section>
  `,
  styles: `
    .assumptions {
      background: #fffdf8;
      border: 1px solid var(--tt-rule);
      border-radius: 4px;
      padding: 8px 14px 12px;
      margin-top: 10px;
    }
    h3 {
      font: var(--mat-sys-title-small);
      margin: 4px 0 6px;
    }
    ul {
      margin: 0 0 8px;
      padding-left: 18px;
      font-size: 12.5px;
      line-height: 1.5;
      color: var(--tt-ink);
    }
    .methods {
      font-size: 12px;
      color: var(--tt-ink-soft);
      margin: 0 0 8px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ModelAssumptions {
  /** The engine's own statement of the model's assumptions (result.assumptions). */
  readonly items = input.required<readonly string[]>();
  /** Published methods behind the figures (critical speed, bearing life …). */
  readonly methods = input<readonly string[]>([]);
  /** The engine states each assumption as a phrase; on the page each reads as a sentence. */
  protected readonly sentences = computed(() =>
    this.items().map((a) => `${a.charAt(0).toUpperCase()}${a.slice(1)}${a.endsWith('.') ? '' : '.'}`),
  );
}
