import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { FindingDto, RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { assertApiFailure } from '../../../core/http/api-failure';
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
  /** One call at a time: a double click must not answer or raise the same finding twice. */
  protected readonly busy = signal(false);
  protected readonly statusText: Record<FindingDto['status'], string> = {
    open: 'open: waiting for the author', answered: 'answered: waiting for a reviewer to close it', closed: 'closed',
  };

  protected async raise(): Promise<void> {
    if (await this.run(() => this.api.raiseFinding(this.revision().id, this.draft().trim()))) this.draft.set('');
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
