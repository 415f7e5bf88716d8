import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { AbilityServiceSignal } from '@casl/angular';
import { subject } from '@casl/ability';
import type { AppAbility } from '../../../../shared/authz/app-ability';
import type { RuleSetSummary } from '../../../../shared/schemas/rule-set.schema';
import { assertApiFailure } from '../../core/http/api-failure';
import { LoadFailure } from '../../ui/load-failure';
import { RuleSetsApi } from './rule-sets-api';

/** Every standard and every version; pick two to compare; compliance starts drafts here. */
@Component({
  selector: 'tt-rule-set-library',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatCheckboxModule, MatProgressBarModule, LoadFailure],
  templateUrl: './rule-set-library.html',
  styleUrl: './rule-set-library.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class RuleSetLibrary {
  private readonly api = inject(RuleSetsApi);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  private readonly ability = inject<AbilityServiceSignal<AppAbility>>(AbilityServiceSignal);
  protected readonly versions = this.api.list();
  protected readonly groups = computed(() => {
    const byCode = new Map<string, RuleSetSummary[]>();
    for (const v of this.versions.hasValue() ? this.versions.value() : [])
      byCode.set(v.code, [...(byCode.get(v.code) ?? []), v]);
    return [...byCode.entries()].map(([code, list]) => ({ code, title: list[0].title, list }));
  });
  protected readonly picked = signal<number[]>([]);
  protected readonly canDraft = computed(() => this.ability.can('create', subject('RuleSet', { status: 'draft' })));

  protected togglePick(id: number, on: boolean): void {
    this.picked.update((p) => (on ? [...p.filter((x) => x !== id), id].slice(-2) : p.filter((x) => x !== id)));
  }

  protected compare(): void {
    const [a, b] = this.picked();
    void this.router.navigate(['/rule-sets/compare'], { queryParams: { from: a, to: b } });
  }

  protected async draftFrom(v: RuleSetSummary): Promise<void> {
    try {
      const draft = await this.api.createDraft(v.id);
      await this.router.navigate(['/rule-sets', draft.id]);
    } catch (error) {
      assertApiFailure(error);
      this.snackBar.open(error.message, 'OK', { duration: 8000 });
    }
  }
}
