import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import type { Comparison, ComparisonRow } from '../../../../../shared/verification';
import { SessionStore } from '../../../core/auth/session-store';
import { assertApiFailure } from '../../../core/http/api-failure';
import { LoadFailure } from '../../../ui/load-failure';
import { SafetyNote } from '../../../ui/safety-note';
import { IndependentModelApi } from './independent-model-api';

const show = (v: ComparisonRow['author'], unit: string) =>
  v === null ? '—' : typeof v === 'number' ? `${+v.toPrecision(5)}${unit ? ` ${unit}` : ''}` : String(v);

/**
 * Which verification the standard asks for, and the independent model: the checker builds their own in the
 * model editor (or loads a calc input file, same format as the author's), sees its verdict, locks it, and
 * everyone then sees the comparison row by row. A blind checker is told why the author's numbers are hidden.
 */
@Component({
  selector: 'tt-independent-model-panel',
  imports: [RouterLink, MatButtonModule, MatIconModule, SafetyNote, LoadFailure],
  templateUrl: './independent-model-panel.html',
  styleUrl: './independent-model-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class IndependentModelPanel {
  private readonly api = inject(IndependentModelApi);
  private readonly me = inject(SessionStore).user;
  readonly revision = input.required<RevisionDto>();
  /** The reader may build the model (an independent checker while the revision is in check). */
  readonly canBuild = input(false);
  readonly changed = output<void>();

  protected readonly v = computed(() => this.revision().verification ?? null);
  /** Read only what the server shows this reader: their own model, or a locked one once they are not blind. */
  private readonly readableId = computed(() => {
    const v = this.v();
    const m = v?.model;
    if (!v || !m) return undefined;
    return m.checker.id === this.me()?.id || (m.state === 'locked' && !v.blind) ? this.revision().id : undefined;
  });
  protected readonly modelRead = this.api.model(this.readableId);
  protected readonly model = computed(() => (this.modelRead.hasValue() ? this.modelRead.value() : null));
  protected readonly message = signal<string | null>(null);
  protected readonly showAll = signal(false);
  protected readonly comparison = computed(() => this.model()?.comparison ?? this.v()?.signed?.comparison ?? null);
  protected readonly rows = computed(() => {
    const rows = this.comparison()?.rows ?? [];
    return this.showAll() ? rows : rows.filter((r) => !r.agrees);
  });
  protected readonly show = show;

  protected async loadFile(event: Event): Promise<void> {
    const file = (event.target as HTMLInputElement).files?.[0];
    if (!file) return;
    this.message.set(null);
    try {
      const input = JSON.parse(await file.text()) as Record<string, unknown>;
      this.modelRead.set(await this.api.save(this.revision().id, input, this.model()?.lockVersion ?? 0));
      this.changed.emit();
    } catch (err) {
      if (err instanceof SyntaxError)
        return this.message.set(`${file.name} is not a calc input file (JSON): ${err.message}`);
      assertApiFailure(err);
      this.message.set(err.lines().join('; '));
    }
  }

  protected async lock(): Promise<void> {
    const m = this.model();
    if (!m) return;
    try {
      this.modelRead.set(await this.api.lock(this.revision().id, m.lockVersion));
      this.changed.emit();
    } catch (err) {
      assertApiFailure(err);
      this.message.set(err.lines().join('; '));
    }
  }

  protected differenceCount(c: Comparison): string {
    const n = c.inputs.differences + c.results.differences;
    return n === 1 ? '1 difference' : `${n} differences`;
  }

  protected percent(r: ComparisonRow): string {
    return r.relative === null ? (r.agrees ? 'same' : 'not the same') : `${+(r.relative * 100).toPrecision(3)} %`;
  }
}
