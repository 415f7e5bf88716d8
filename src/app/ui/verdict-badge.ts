import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

/** The checklist verdict against the standard: complies, does not comply, or not yet evaluated. */
@Component({
  selector: 'tt-verdict-badge',
  template: `<span class="v" [class.ok]="kind() === 'ok'" [class.bad]="kind() === 'bad'">{{ text() }}</span>`,
  styles: `
    .v {
      font-size: 12px;
      font-weight: 500;
      color: var(--tt-ink-soft);
      white-space: nowrap;
    }
    .v.ok {
      color: var(--tt-pass);
    }
    .v.ok::before {
      content: '✓ ';
    }
    .v.bad {
      color: var(--tt-fail);
    }
    .v.bad::before {
      content: '✗ ';
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VerdictBadge {
  readonly verdict = input<string | null>(null);
  protected readonly kind = computed(() => (this.verdict() === 'compliant' ? 'ok' : this.verdict() ? 'bad' : 'none'));
  protected readonly text = computed(() =>
    this.verdict() === 'compliant' ? 'Meets standard' : this.verdict() ? 'Fails standard' : 'Not evaluated',
  );
}
