import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import type { IndependentModelDto } from '../../../../../shared/schemas/independent-model.schema';
import type { ComparisonRow } from '../../../../../shared/verification';
import { assertApiFailure } from '../../../core/http/api-failure';
import { SafetyNote } from '../../../ui/safety-note';
import { IndependentModelApi } from './independent-model-api';

const show = (v: ComparisonRow['author'], unit: string) =>
  v === null ? '—' : typeof v === 'number' ? `${+v.toPrecision(5)}${unit ? ` ${unit}` : ''}` : String(v);

/**
 * Which verification the standard asks for, and the independent model: the checker loads their own
 * calc input (same file format as the author's), sees its verdict, locks it, and everyone then sees
 * the comparison row by row. A blind checker is told why the author's numbers are hidden.
 */
@Component({
  selector: 'tt-independent-model-panel',
  imports: [MatButtonModule, MatIconModule, SafetyNote],
  templateUrl: './independent-model-panel.html',
  styleUrl: './independent-model-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class IndependentModelPanel {
  private readonly api = inject(IndependentModelApi);
  readonly revision = input.required<RevisionDto>();
  /** The reader may build the model (an independent checker while the revision is in check). */
  readonly canBuild = input(false);
  readonly changed = output<void>();

  protected readonly model = signal<IndependentModelDto | null>(null);
  protected readonly message = signal<string | null>(null);
  protected readonly showAll = signal(false);
  protected readonly v = computed(() => this.revision().verification ?? null);
  protected readonly comparison = computed(() => this.model()?.comparison ?? this.v()?.signed?.comparison ?? null);
  protected readonly rows = computed(() => {
    const rows = this.comparison()?.rows ?? [];
    return this.showAll() ? rows : rows.filter((r) => !r.agrees);
  });
  protected readonly show = show;

  constructor() {
    effect(() => this.loadModel(this.revision()));
  }

  private async loadModel(r: RevisionDto): Promise<void> {
    if (!r.verification?.model) return this.model.set(null);
    try {
      this.model.set(await this.api.read(r.id));
    } catch {
      this.model.set(null); // not theirs to see yet: the verification summary says why
    }
  }

  protected async loadFile(event: Event): Promise<void> {
    const file = (event.target as HTMLInputElement).files?.[0];
    if (!file) return;
    this.message.set(null);
    try {
      const input = JSON.parse(await file.text()) as Record<string, unknown>;
      this.model.set(await this.api.save(this.revision().id, input, this.model()?.lockVersion ?? 0));
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
      this.model.set(await this.api.lock(this.revision().id, m.lockVersion));
      this.changed.emit();
    } catch (err) {
      assertApiFailure(err);
      this.message.set(err.lines().join('; '));
    }
  }

  protected percent(r: ComparisonRow): string {
    return r.relative === null ? (r.agrees ? 'same' : 'not the same') : `${+(r.relative * 100).toPrecision(3)} %`;
  }
}
