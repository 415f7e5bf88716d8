import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { Checklist } from '../../../../../shared/rules';
import { featureTypesOf, findingPlace } from '../../../../../shared/format';
import { inputOptions, rowOptions, WHOLE_CALC, type AnchorOption } from './finding-anchors';
import type { FindingDto, RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { assertApiFailure } from '../../../core/http/api-failure';
import { EmptyState } from '../../../ui/empty-state';
import { CalcsApi } from '../calcs-api';

/**
 * Findings stay on the record with their answers: raised by the reviewer, answered by the author, closed by a reviewer.
 */
@Component({
  selector: 'tt-findings-panel',
  imports: [DatePipe, FormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule, EmptyState],
  templateUrl: './findings-panel.html',
  styleUrl: './findings-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FindingsPanel {
  private readonly api = inject(CalcsApi);
  readonly revision = input.required<RevisionDto>();
  readonly canRaise = input(false);
  readonly canAnswer = input(false);
  readonly changed = output<RevisionDto>();
  protected readonly draft = signal('');
  /** What the new finding concerns: the key of a checklist row or an input, '' for the calc as a whole. */
  readonly anchorKey = signal('');
  protected readonly wholeCalc = WHOLE_CALC;
  protected readonly rowChoices = computed(() => rowOptions((this.revision().checklist ?? null) as Checklist | null));
  protected readonly inputChoices = computed(() => inputOptions(this.revision()));
  private readonly featureTypes = computed(() => featureTypesOf(this.revision().input));
  protected readonly answers = signal<Record<number, string>>({});
  protected readonly problem = signal<string | null>(null);
  /** One call at a time: a double click must not answer or raise the same finding twice. */
  protected readonly busy = signal(false);
  protected readonly statusText: Record<FindingDto['status'], string> = {
    open: 'open: waiting for the author',
    answered: 'answered: waiting for a reviewer to close it',
    closed: 'closed',
  };

  protected async raise(): Promise<void> {
    const chosen: AnchorOption =
      [...this.rowChoices(), ...this.inputChoices()].find((o) => o.key === this.anchorKey()) ?? WHOLE_CALC;
    if (await this.run(() => this.api.raiseFinding(this.revision().id, this.draft().trim(), chosen.anchor))) {
      this.draft.set('');
      this.anchorKey.set('');
    }
  }

  /** Where a finding sits ("§5.1, Segment 2"; "Segment 1, outer ⌀"), or null for the calc as a whole. */
  protected placeOf(f: FindingDto): string | null {
    return findingPlace(f, this.featureTypes());
  }

  protected answerOf(id: number): string {
    return this.answers()[id] ?? '';
  }

  protected setAnswer(id: number, text: string): void {
    this.answers.update((a) => ({ ...a, [id]: text }));
  }

  protected async answer(id: number): Promise<void> {
    if (await this.run(() => this.api.answerFinding(id, this.answerOf(id).trim()))) this.setAnswer(id, '');
  }

  protected async close(id: number): Promise<void> {
    await this.run(() => this.api.closeFinding(id));
  }

  private async run(call: () => Promise<RevisionDto>): Promise<boolean> {
    if (this.busy()) return false;
    this.busy.set(true);
    this.problem.set(null);
    try {
      this.changed.emit(await call());
      return true;
    } catch (error) {
      assertApiFailure(error);
      this.problem.set(error.message);
      return false;
    } finally {
      this.busy.set(false);
    }
  }
}
