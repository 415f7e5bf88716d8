import { ChangeDetectionStrategy, Component, computed, inject, output, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { AbilityServiceSignal } from '@casl/angular';
import { subject } from '@casl/ability';
import type { AppAbility } from '../../../../../shared/authz/app-ability';
import type { RoleGrantDto } from '../../../../../shared/schemas/role-grant.schema';
import { assertApiFailure } from '../../../core/http/api-failure';
import { LoadFailure } from '../../../ui/load-failure';
import { RoleLabelPipe } from '../../../ui/role-label';
import { RoleGrantsApi } from './role-grants-api';

type Decision = { id: number; kind: 'confirm' | 'refuse' };

/**
 * Signing roles asked for someone, waiting for a second person. Only someone who neither asked
 * nor would receive the role may decide; the server enforces it, the buttons only mirror it.
 */
@Component({
  selector: 'tt-pending-grants',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    RoleLabelPipe,
    LoadFailure,
  ],
  templateUrl: './pending-grants.html',
  styleUrl: './pending-grants.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PendingGrants {
  private readonly api = inject(RoleGrantsApi);
  private readonly ability = inject<AbilityServiceSignal<AppAbility>>(AbilityServiceSignal);
  /** Tells the page that someone's roles changed. */
  readonly decided = output<RoleGrantDto>();

  protected readonly grants = this.api.pending();
  protected readonly rows = computed(() => (this.grants.hasValue() ? this.grants.value() : []));
  protected readonly open = signal<Decision | null>(null);
  protected readonly problems = signal<string[]>([]);
  protected readonly isSending = signal(false);
  protected readonly password = new FormControl('', { nonNullable: true, validators: [Validators.required] });
  protected readonly reason = new FormControl('', {
    nonNullable: true,
    validators: [Validators.required, Validators.minLength(3)],
  });

  /** Called by the page after it asked for a role, so the new request shows at once. */
  reload(): void {
    this.grants.reload();
  }

  protected mayDecide(g: RoleGrantDto): boolean {
    return this.ability.can('confirm', subject('RoleGrant', { userId: g.user.id, requestedBy: g.requestedBy.id }));
  }

  protected start(id: number, kind: Decision['kind']): void {
    this.open.set({ id, kind });
    this.problems.set([]);
    this.password.reset();
    this.reason.reset();
  }

  protected async send(g: RoleGrantDto, event: Event): Promise<void> {
    event.preventDefault();
    const kind = this.open()?.kind;
    const control = kind === 'confirm' ? this.password : this.reason;
    if (control.invalid) return control.markAsTouched();
    this.isSending.set(true);
    this.problems.set([]);
    try {
      const done =
        kind === 'confirm'
          ? await this.api.confirm(g.id, this.password.value)
          : await this.api.refuse(g.id, this.reason.value);
      this.open.set(null);
      this.decided.emit(done);
      this.grants.reload();
    } catch (error) {
      assertApiFailure(error);
      this.problems.set(error.lines());
    } finally {
      this.password.reset();
      this.isSending.set(false);
    }
  }
}
