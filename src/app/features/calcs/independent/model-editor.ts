import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  numberAttribute,
  signal,
  untracked,
} from '@angular/core';
import { RouterLink } from '@angular/router';
import { A11yModule } from '@angular/cdk/a11y';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ErrorStateMatcher } from '@angular/material/core';
import type { UnitSystem } from '../../../../../shared/engine';
import { SessionStore } from '../../../core/auth/session-store';
import { LoadFailure } from '../../../ui/load-failure';
import { StateBadge } from '../../../ui/state-badge';
import { CalcsApi } from '../calcs-api';
import { planActions } from '../calc-page/revision-actions';
import { IndependentModelApi } from '../calc-page/independent-model-api';
import { IndependentModelPanel } from '../calc-page/independent-model-panel';
import { CalcWorkbench } from '../editor/calc-workbench';
import { editorForm, type EditorValue } from '../editor/editor-form';
import { EDITOR_DEBOUNCE_MS, EngineErrorState, canonical } from '../editor/editor-support';
import { debouncedValue } from '../editor/form-stream';
import { inputToValue } from '../editor/form-values';
import { valueToInput } from '../editor/form-to-input';
import { ModelDraft } from './model-draft';
import { modelStandard } from './model-standard';
import { SourceDocuments } from './source-documents';

const EMPTY = inputToValue({});

/**
 * The checker's independent model in the calc editor's own panels. It starts empty of the author's numbers
 * (the server sends a blind checker none), with the calc's attachments above it; the draft is saved with its
 * version, and "Lock and compare" is a separate, final step that shows the comparison on this page.
 */
@Component({
  selector: 'tt-model-editor',
  imports: [
    RouterLink,
    A11yModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    LoadFailure,
    StateBadge,
    CalcWorkbench,
    SourceDocuments,
    IndependentModelPanel,
  ],
  templateUrl: './model-editor.html',
  styleUrls: ['../editor/revision-editor.scss', './model-editor.scss'],
  providers: [ModelDraft, { provide: ErrorStateMatcher, useClass: EngineErrorState }],
  host: { '(window:beforeunload)': 'warnBeforeUnload($event)' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class ModelEditor {
  private readonly calcs = inject(CalcsApi);
  private readonly me = inject(SessionStore).user;
  protected readonly draft = inject(ModelDraft);
  readonly id = input.required({ transform: numberAttribute });

  protected readonly revisionRead = this.calcs.revision(this.id);
  protected readonly revision = computed(() => (this.revisionRead.hasValue() ? this.revisionRead.value() : null));
  private readonly calc = this.calcs.calc(computed(() => this.revision()?.calcId));
  protected readonly calcInfo = computed(() => (this.calc.hasValue() ? this.calc.value() : null));
  protected readonly standardRead = inject(IndependentModelApi).standard(computed(() => this.revision()?.ruleSet.id));
  private readonly standard = modelStandard(this.standardRead);
  protected readonly ruleSet = this.standard.ruleSet;
  protected readonly ruleSetProblem = this.standard.problem;

  protected readonly form = signal(editorForm(EMPTY));
  protected readonly units = signal<UnitSystem>('SI');
  protected readonly value = debouncedValue(this.form, inject(EDITOR_DEBOUNCE_MS));
  protected readonly need = computed(() => this.revision()?.verification?.need ?? null);
  private readonly mayCheck = computed(() => {
    const r = this.revision();
    return !!r && planActions(r, this.me(), true).actions.has('raise-finding');
  });
  protected readonly canBuild = computed(
    () =>
      this.mayCheck() &&
      this.need()?.method === 'independent-model' &&
      this.draft.isReady() &&
      !this.draft.isOthers() &&
      !this.draft.isLocked() &&
      this.draft.model()?.state !== 'locked',
  );
  protected readonly isDirty = computed(
    () => this.draft.baseline() !== null && canonical(valueToInput(this.value())) !== this.draft.baseline(),
  );
  protected readonly confirmingLock = signal(false);

  constructor() {
    effect(() => this.draft.follow(this.revision()));
    // The stored draft fills the form once, when it first arrives (or after "reload"); later saves keep the typing.
    effect(() => {
      const ready = this.draft.isReady() && !this.revisionRead.isLoading() && !this.draft.read.isLoading();
      const model = this.draft.model();
      if (ready && untracked(this.draft.baseline) === null) untracked(() => this.show(model?.input ?? {}));
    });
  }

  private show(input: Record<string, unknown>): void {
    const v = inputToValue(input);
    this.draft.baseline.set(canonical(valueToInput(v)));
    this.replaceForm(v);
  }

  protected replaceForm(v: EditorValue): void {
    this.units.set(v.units);
    this.form.set(editorForm(v, untracked(this.form)));
  }

  protected save(): Promise<boolean> {
    return this.draft.save(valueToInput(this.form().getRawValue()));
  }

  /** Saves what is on screen first, so the locked model is exactly what the checker sees. */
  protected async lock(): Promise<void> {
    this.confirmingLock.set(false);
    if (this.isDirty() && !(await this.save())) return;
    if (await this.draft.lock()) this.revisionRead.reload();
  }

  /** After a 409: the stored draft replaces the form (the checker chose to). */
  protected reloadStored(): void {
    this.draft.baseline.set(null);
    this.draft.conflict.set(null);
    this.revisionRead.reload();
    this.draft.read.reload();
  }

  protected warnBeforeUnload(event: BeforeUnloadEvent): void {
    if (this.isDirty()) event.preventDefault();
  }

  /** Called by the route's CanDeactivate guard: unsaved typing is never dropped without asking. */
  confirmLeave(): boolean {
    return !this.isDirty() || window.confirm('Your independent model has unsaved changes. Leave without saving?');
  }
}
