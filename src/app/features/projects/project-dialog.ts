import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { createProjectSchema, type ProjectDto } from '../../../../shared/schemas/project.schema';
import { assertApiFailure } from '../../core/http/api-failure';
import { schemaValidator } from '../../core/forms/schema-validator';
import { applyServerErrors } from '../../ui/field-errors';
import { ProjectsApi } from './projects-api';

const FIELDS = createProjectSchema.shape;

@Component({
  selector: 'tt-project-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule],
  templateUrl: './project-dialog.html',
  styles:
    '.form { display: grid; gap: 12px; min-width: min(520px, 80vw); padding-top: 8px; } .problem { color: var(--tt-fail); margin: 0; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectDialog {
  private readonly api = inject(ProjectsApi);
  private readonly ref = inject(MatDialogRef<ProjectDialog, ProjectDto>);
  protected readonly existing = inject<ProjectDto | null>(MAT_DIALOG_DATA);
  private readonly fb = inject(NonNullableFormBuilder);

  protected readonly form = this.fb.group({
    code: [this.existing?.code ?? '', [Validators.required, schemaValidator(FIELDS.code, 'Project code')]],
    name: [this.existing?.name ?? '', [Validators.required, schemaValidator(FIELDS.name, 'Name')]],
    client: [this.existing?.client ?? '', [schemaValidator(FIELDS.client, 'Client')]],
    description: [this.existing?.description ?? '', [schemaValidator(FIELDS.description, 'Description')]],
    revisionScheme: [this.existing?.revisionScheme ?? ('letters' as 'letters' | 'numbers')],
    status: [this.existing?.status ?? ('active' as 'active' | 'archived')],
  });
  protected readonly problems = signal<string[]>([]);
  protected readonly isSaving = signal(false);

  constructor() {
    if (this.existing) this.form.controls.code.disable();
  }

  protected async save(): Promise<void> {
    if (this.form.invalid) return this.form.markAllAsTouched();
    this.isSaving.set(true);
    const { code, status, ...rest } = this.form.getRawValue();
    try {
      const saved = this.existing
        ? await this.api.update(this.existing.id, { ...rest, status, version: this.existing.version })
        : await this.api.create({ code, ...rest });
      this.ref.close(saved);
    } catch (error) {
      assertApiFailure(error);
      this.problems.set(applyServerErrors(this.form, error));
    } finally {
      this.isSaving.set(false);
    }
  }
}
