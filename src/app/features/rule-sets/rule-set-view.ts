import { FILLET_KTS_NAMES } from '../../../../shared/engine/methods';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  numberAttribute,
  signal,
} from '@angular/core';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { FormsModule, ReactiveFormsModule } from '@angular/forms';
import { MatTabsModule } from '@angular/material/tabs';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { AbilityServiceSignal } from '@casl/angular';
import { subject } from '@casl/ability';
import { verificationLines, type RuleSet } from '../../../../shared/rules';
import type { AppAbility } from '../../../../shared/authz/app-ability';
import { assertApiFailure } from '../../core/http/api-failure';
import { LoadFailure } from '../../ui/load-failure';
import { checkRuleSetText, ruleSetProblems, type RuleSetProblem } from './rule-set-messages';
import { RuleSetsApi } from './rule-sets-api';
import { applyRuleSetForm, buildRuleSetForm, type RuleSetForm } from './rule-set-form';
import { PublishPanel } from './publish-panel';
import { TryItPanel } from './try-it-panel';
import { ImpactPanel } from './impact-panel';

/** One version of a standard: read by everyone, edited (as a draft) by compliance only. */
@Component({
  selector: 'tt-rule-set-view',
  imports: [
    DatePipe,
    RouterLink,
    FormsModule,
    ReactiveFormsModule,
    MatTabsModule,
    MatButtonModule,
    MatIconModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatProgressBarModule,
    PublishPanel,
    TryItPanel,
    ImpactPanel,
    LoadFailure,
  ],
  templateUrl: './rule-set-view.html',
  styleUrl: './rule-set-view.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class RuleSetView {
  /** The published method, named as a reader cites it, not its code. */
  protected ktsName(key: string | undefined): string {
    return key ? (FILLET_KTS_NAMES[key] ?? key) : '—';
  }

  private readonly api = inject(RuleSetsApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly ability = inject<AbilityServiceSignal<AppAbility>>(AbilityServiceSignal);
  readonly id = input.required({ transform: numberAttribute });
  protected readonly version = this.api.one(this.id);
  protected readonly current = computed(() => (this.version.hasValue() ? this.version.value() : undefined));
  protected readonly doc = computed(() => this.current()?.document as RuleSet | undefined);
  /** The standard's verification block (independent model, scope, tolerances) in plain words. */
  protected readonly checking = computed(() => {
    const doc = this.doc();
    return doc ? verificationLines(doc.verification) : undefined;
  });
  protected readonly canEdit = computed(() => {
    const v = this.current();
    return (
      v?.status === 'draft' && !v.confirmedBy && this.ability.can('update', subject('RuleSet', { status: 'draft' }))
    );
  });
  protected readonly canPublish = computed(
    () => this.current()?.status === 'draft' && this.ability.can('publish', 'RuleSet'),
  );
  protected readonly canImpact = computed(() => this.ability.can('impact', 'RuleSet'));
  protected readonly form = signal<RuleSetForm | null>(null);
  protected readonly jsonText = signal('');
  protected readonly jsonIssues = signal<string[]>([]);
  protected readonly problems = signal<RuleSetProblem[]>([]);
  /** The tab on show: a problem's link opens the tab where its field is edited. */
  protected readonly tab = signal(0);
  protected readonly isSaving = signal(false);

  constructor() {
    effect(() => {
      const doc = this.doc();
      if (!doc) return;
      this.form.set(buildRuleSetForm(doc));
      this.jsonText.set(JSON.stringify(doc, null, 2));
      this.jsonIssues.set([]);
    });
  }

  protected checkJson(): RuleSet | null {
    const checked = checkRuleSetText(this.jsonText(), this.doc() ?? null);
    this.jsonIssues.set(checked.issues);
    return checked.value;
  }

  protected saveForm(): Promise<void> {
    return this.persist(applyRuleSetForm(this.doc()!, this.form()!));
  }

  protected async saveJson(): Promise<void> {
    const doc = this.checkJson();
    if (doc) await this.persist(doc);
  }

  private async persist(doc: RuleSet): Promise<void> {
    this.isSaving.set(true);
    this.problems.set([]);
    try {
      const saved = await this.api.save(
        this.id(),
        doc as unknown as Record<string, unknown>,
        this.current()!.lockVersion,
      );
      this.version.set(saved);
      this.snackBar.open(`Draft v${saved.version} saved.`, 'OK', { duration: 4000 });
    } catch (error) {
      assertApiFailure(error);
      this.problems.set(ruleSetProblems(error, doc));
    } finally {
      this.isSaving.set(false);
    }
  }

  protected reloaded(): void {
    this.version.reload();
  }
}
