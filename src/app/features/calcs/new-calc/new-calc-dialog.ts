import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import type { ProjectDto } from '../../../../../shared/schemas/project.schema';
import { createCalcSchema } from '../../../../../shared/schemas/revision.schema';
import { assertApiFailure } from '../../../core/http/api-failure';
import { schemaValidator } from '../../../core/forms/schema-validator';
import { LoadFailure } from '../../../ui/load-failure';
import { applyServerErrors } from '../../../ui/field-errors';
import { CalcsApi } from '../calcs-api';
import { starterInput } from './starter-input';

const FIELDS = createCalcSchema.shape;

@Component({
  selector: 'tt-new-calc-dialog',
  imports: [
    ReactiveFormsModule,
    MatDialogModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonToggleModule,
    LoadFailure,
  ],
  templateUrl: './new-calc-dialog.html',
  styles:
    '.form { display: grid; gap: 12px; padding-top: 8px; } .problem { color: var(--tt-fail); margin: 0; } .units { display: flex; align-items: center; gap: 12px; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewCalcDialog {
  private readonly api = inject(CalcsApi);
  private readonly ref = inject(MatDialogRef<NewCalcDialog>);
  protected readonly project = inject<ProjectDto>(MAT_DIALOG_DATA);
  protected readonly ruleSetList = this.api.ruleSets();
  protected readonly effective = computed(() =>
    (this.ruleSetList.hasValue() ? this.ruleSetList.value() : []).filter((r) => r.status === 'effective'),
  );
  protected readonly form = inject(NonNullableFormBuilder).group({
    number: ['', [Validators.required, schemaValidator(FIELDS.number, 'Calc number')]],
    title: ['', [Validators.required, schemaValidator(FIELDS.title, 'Title')]],
    partRef: ['', schemaValidator(FIELDS.partRef, 'Drawing or part reference')],
    ruleSetId: [0, Validators.min(1)],
    units: ['SI' as 'SI' | 'US'],
  });
  protected readonly problems = signal<string[]>([]);
  protected readonly isSaving = signal(false);

  protected async create(): Promise<void> {
    if (this.form.invalid) return this.form.markAllAsTouched();
    this.isSaving.set(true);
    const { units, ...rest } = this.form.getRawValue();
    try {
      const calc = await this.api.create({ ...rest, projectId: this.project.id, input: starterInput(units) });
      this.ref.close({ calcId: calc.id, revisionId: calc.latest.id });
    } catch (error) {
      assertApiFailure(error);
      this.problems.set(applyServerErrors(this.form, error));
    } finally {
      this.isSaving.set(false);
    }
  }
}
