import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { toHttpFailure } from '../../../core/errors/http-failure';
import { EmptyState } from '../../../ui/empty-state';
import { CalcsApi } from '../calcs-api';

/** Findings stay on the record with their answers: raised by the reviewer, answered by the author, closed by a reviewer. */
@Component({
  selector: 'tt-findings-panel',
  imports: [DatePipe, FormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, EmptyState],
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
  protected readonly answers = signal<Record<number, string>>({});
  protected readonly problem = signal<string | null>(null);

  protected async raise(): Promise<void> {
    await this.run(() => this.api.raiseFinding(this.revision().id, this.draft().trim()));
    this.draft.set('');
  }

  protected answerOf(id: number): string {
    return this.answers()[id] ?? '';
  }

  protected setAnswer(id: number, text: string): void {
    this.answers.update((a) => ({ ...a, [id]: text }));
  }

  protected answer(id: number): Promise<void> {
    return this.run(() => this.api.answerFinding(id, this.answerOf(id).trim()));
  }

  protected close(id: number): Promise<void> {
    return this.run(() => this.api.closeFinding(id));
  }

  private async run(call: () => Promise<RevisionDto>): Promise<void> {
    this.problem.set(null);
    try {
      this.changed.emit(await call());
    } catch (error) {
      this.problem.set(toHttpFailure(error).message);
    }
  }
}
