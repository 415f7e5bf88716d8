import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { DatePipe } from '@angular/common';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule } from '@angular/material/dialog';
import { MatButtonModule } from '@angular/material/button';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { compareInputs } from './json-compare';
import { placeOf } from './issue-map';

export interface ConflictData {
  mine: Record<string, unknown>;
  myBase: number;
  theirs: RevisionDto;
}

/** What the author decides when the stored revision changed since their edits began. */
export type ConflictChoice = 'keep-mine' | 'take-theirs' | undefined;

/**
 * Shown on a 409: both versions side by side, field by field. Nothing is overwritten unless the author
 * chooses "keep mine", which saves over the stored version knowingly (with its lockVersion).
 */
@Component({
  selector: 'tt-conflict-dialog',
  imports: [DatePipe, MatDialogModule, MatButtonModule],
  templateUrl: './conflict-dialog.html',
  styleUrl: './conflict-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConflictDialog {
  protected readonly data = inject<ConflictData>(MAT_DIALOG_DATA);
  protected readonly rows = computed(() =>
    compareInputs(this.data.mine, this.data.theirs.input).map((d) => ({ ...d, place: placeOf(d.path) })),
  );
}

/** Opens the dialog wide enough for both versions side by side; settles with the author's choice. */
export function askConflict(dialog: MatDialog, data: ConflictData): Promise<ConflictChoice> {
  const ref = dialog.open<ConflictDialog, ConflictData, ConflictChoice>(ConflictDialog, {
    data,
    width: '920px',
    maxWidth: '96vw',
  });
  return firstValueFrom(ref.afterClosed());
}
