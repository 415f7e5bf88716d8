import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { ReactiveFormsModule, type FormControl } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

/** A short heading for the calc input and free notes for the checker (assumptions, drawing references). */
@Component({
  selector: 'tt-notes-panel',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule],
  template: `
    <section class="panel" aria-labelledby="notes-h">
      <h2 id="notes-h">Notes</h2>
      <mat-form-field class="full">
        <mat-label>What this calc covers</mat-label>
        <input matInput [formControl]="title()" maxlength="200" />
      </mat-form-field>
      <mat-form-field class="full">
        <mat-label>{{ notesLabel() }}</mat-label>
        <textarea matInput [formControl]="notes()" rows="4" maxlength="5000" data-path="notes"></textarea>
        <mat-hint>Assumptions, load sources, drawing references. {{ notes().value.length }} / 5000</mat-hint>
      </mat-form-field>
    </section>
  `,
  styleUrl: './editor-panels.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotesPanel {
  readonly title = input.required<FormControl<string>>();
  readonly notes = input.required<FormControl<string>>();
  /** The author writes for the checker; a checker's independent model keeps its own notes. */
  readonly notesLabel = input('Notes for the checker');
}
