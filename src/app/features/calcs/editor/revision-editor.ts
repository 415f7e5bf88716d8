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
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ErrorStateMatcher } from '@angular/material/core';
import { AbilityServiceSignal } from '@casl/angular';
import { subject } from '@casl/ability';
import type { UnitSystem } from '../../../../../shared/engine';
import type { AppAbility } from '../../../../../shared/authz/app-ability';
import { EDITABLE_STATES } from '../../../../../shared/workflow/state-sets';
import { StateBadge } from '../../../ui/state-badge';
import { editorForm, type EditorForm, type EditorValue } from './editor-form';
import { EditorStore } from './editor-store';
import { EDITOR_DEBOUNCE_MS, EngineErrorState, canonical } from './editor-support';
import { inputToValue } from './form-values';
import { valueToInput } from './form-to-input';
import { EditorSession } from './editor-session';
import { CalcWorkbench } from './calc-workbench';
import { debouncedValue } from './form-stream';
import type { Checklist } from '../../../../../shared/rules';

/**
 * The author's calc editor. The form is replaced as a whole on load, restore, "take theirs" and unit
 * change; every edit flows (debounced) through the shared engine and rule set in the browser, is kept
 * locally, and reaches the server only through the explicit, versioned "Save revision".
 */
@Component({
  selector: 'tt-revision-editor',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, StateBadge, CalcWorkbench],
  templateUrl: './revision-editor.html',
  styleUrl: './revision-editor.scss',
  providers: [EditorStore, EditorSession, { provide: ErrorStateMatcher, useClass: EngineErrorState }],
  host: { '(window:beforeunload)': 'warnBeforeUnload($event)', '(window:pagehide)': 'session.keepLocalCopy()' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class RevisionEditor {
  protected readonly store = inject(EditorStore);
  protected readonly session = inject(EditorSession);
  private readonly ability = inject<AbilityServiceSignal<AppAbility>>(AbilityServiceSignal);
  private readonly debounceMs = inject(EDITOR_DEBOUNCE_MS);

  readonly id = input.required({ transform: numberAttribute });

  protected readonly form = signal<EditorForm>(editorForm(inputToValue({})));
  protected readonly units = signal<UnitSystem>('SI');
  // The empty form's value until the stored input has passed the debounce: not an edit by the author.
  private readonly placeholder = this.form().getRawValue();
  private readonly value = debouncedValue(this.form, this.debounceMs, this.placeholder);

  protected readonly authorValue = this.value;
  protected readonly authorInput = computed(() => valueToInput(this.value()));
  protected readonly revision = this.store.revision;
  protected readonly isEditableState = computed(
    () => !!this.revision() && EDITABLE_STATES.includes(this.revision()!.status),
  );
  protected readonly canEdit = computed(() => {
    const r = this.revision();
    return (
      !!r &&
      EDITABLE_STATES.includes(r.status) &&
      this.ability.can(
        'update',
        subject('Revision', { id: r.id, calcId: r.calcId, status: r.status, authorId: r.author.id }),
      )
    );
  });
  protected readonly isDirty = computed(
    () => this.session.isLoaded() && canonical(this.authorInput()) !== this.session.baseline(),
  );
  /** The stored verdict shows with the stored input at once, until the author edits. */
  protected readonly storedChecklist = computed(() => {
    const stored = this.revision()?.checklist as Checklist | null | undefined;
    const isEdited = this.value() !== this.placeholder && this.isDirty();
    return stored && !isEdited ? stored : null;
  });
  /** Findings anchored to an input (not to a checklist clause), shown beside their fields. */
  protected readonly inputFindings = computed(() =>
    (this.revision()?.findings ?? []).filter((f) => f.anchorPath && !f.clauseRef),
  );
  constructor() {
    this.session.attach({
      form: () => this.form(),
      replace: (v) => this.replaceForm(v),
      canEdit: this.canEdit,
      authorInput: this.authorInput,
    });
    effect(() => {
      const id = this.id();
      untracked(() => void this.session.open(id));
    });
  }

  protected replaceForm(v: EditorValue): void {
    this.units.set(v.units);
    this.form.set(editorForm(v, untracked(this.form)));
  }

  protected warnBeforeUnload(event: BeforeUnloadEvent): void {
    this.session.keepLocalCopy();
    if (this.session.hasUnsavedChanges()) event.preventDefault();
  }

  /** Called by the route's CanDeactivate guard. */
  confirmLeave(): boolean | Promise<boolean> {
    return this.session.confirmLeave();
  }
}
