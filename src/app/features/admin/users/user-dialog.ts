import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { ROLES, ROLE_DUTIES, ROLE_LABELS, type Role } from '../../../../../shared/authz/roles';
import { createUserSchema, type UserDto } from '../../../../../shared/schemas/user.schema';
import { assertApiFailure } from '../../../core/http/api-failure';
import { schemaValidator } from '../../../core/forms/schema-validator';
import { applyServerErrors } from '../../../ui/field-errors';
import { UsersApi } from './users-api';

const FIELDS = createUserSchema.shape;

@Component({
  selector: 'tt-user-dialog',
  imports: [
    ReactiveFormsModule,
    MatDialogModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatCheckboxModule,
  ],
  templateUrl: './user-dialog.html',
  styleUrl: './user-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UserDialog {
  private readonly api = inject(UsersApi);
  private readonly ref = inject(MatDialogRef<UserDialog, UserDto>);
  protected readonly existing = inject<UserDto | null>(MAT_DIALOG_DATA);
  private readonly fb = inject(NonNullableFormBuilder);

  protected readonly roleOptions = ROLES.map((role) => ({ role, label: ROLE_LABELS[role], duty: ROLE_DUTIES[role] }));
  protected readonly form = this.fb.group({
    username: [this.existing?.username ?? '', [Validators.required, schemaValidator(FIELDS.username, 'Username')]],
    displayName: [
      this.existing?.displayName ?? '',
      [Validators.required, schemaValidator(FIELDS.displayName, 'Printed name')],
    ],
    email: [this.existing?.email ?? '', [Validators.required, schemaValidator(FIELDS.email, 'E-mail')]],
    initialPassword: [
      '',
      this.existing ? [] : [Validators.required, schemaValidator(FIELDS.initialPassword, 'First password')],
    ],
  });
  // Roles awaiting confirmation stay ticked: unticking one withdraws the request.
  protected readonly roles = signal<Set<Role>>(
    new Set([...(this.existing?.roles ?? []), ...(this.existing?.pendingRoles ?? [])]),
  );
  protected readonly pending = new Set<Role>(this.existing?.pendingRoles ?? []);
  protected readonly requireCode = signal(this.existing?.secondFactorRequired ?? false);
  protected readonly problems = signal<string[]>([]);
  protected readonly isSaving = signal(false);

  constructor() {
    if (this.existing) this.form.controls.username.disable();
  }

  protected toggleRole(role: Role, checked: boolean): void {
    this.roles.update((set) => {
      const next = new Set(set);
      if (checked) next.add(role);
      else next.delete(role);
      return next;
    });
  }

  protected async save(): Promise<void> {
    if (this.form.invalid || this.roles().size === 0) {
      this.form.markAllAsTouched();
      this.problems.set(this.roles().size === 0 ? ['Give the person at least one role'] : []);
      return;
    }
    this.isSaving.set(true);
    const { username, displayName, email, initialPassword } = this.form.getRawValue();
    const roles = ROLES.filter((r) => this.roles().has(r));
    try {
      const saved = this.existing
        ? await this.api.update(this.existing.id, {
            displayName,
            email,
            roles,
            secondFactorRequired: this.requireCode(),
            version: this.existing.version,
          })
        : await this.api.create({ username, displayName, email, roles, initialPassword });
      this.ref.close(saved);
    } catch (error) {
      assertApiFailure(error);
      this.problems.set(applyServerErrors(this.form, error));
    } finally {
      this.isSaving.set(false);
    }
  }
}
