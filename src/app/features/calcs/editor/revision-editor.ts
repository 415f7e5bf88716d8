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
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { debounceTime, identity, map, startWith, switchMap } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ErrorStateMatcher } from '@angular/material/core';
import { AbilityServiceSignal } from '@casl/angular';
import { subject } from '@casl/ability';
import type { UnitSystem } from '../../../../../shared/engine';
import type { AppAbility } from '../../../../../shared/authz/app-ability';
import { EDITABLE_STATES } from '../../../../../shared/schemas/revision.schema';
import { StateBadge } from '../../../ui/state-badge';
import { editorForm, type EditorForm, type EditorValue } from './editor-form';
import { EditorStore } from './editor-store';
import { EDITOR_DEBOUNCE_MS, EngineErrorState, canonical } from './editor-support';
import { inputToValue, valueToInput } from './form-values';
import { toIssueMap } from './issue-map';
import { applyIssues } from './apply-issues';
import { liveCalc, type ChecklistState } from './live-calc';
import { plotLimits } from './plot-limits';
import { CRITERION_KEYS } from './result-format';
import { switchUnits, type Conversion } from './unit-convert';
import { EditorSession } from './editor-session';
import { MaterialPanel } from './material-panel';
import { SegmentsTable } from './segments-table';
import { FeaturesList } from './features-list';
import { LoadsPanel } from './loads-panel';
import { SupportsPanel } from './supports-panel';
import { ForcesPanel } from './forces-panel';
import { DynamicsPanel } from './dynamics-panel';
import { FatiguePanel } from './fatigue-panel';
import { NotesPanel } from './notes-panel';
import { LiveResults } from './live-results';
import { LiveDetails } from './live-details';
import { plainDecimal } from './number-text';
import { VerdictStrip, type StoredChecklist } from './verdict-strip';
import { InputFindings } from './input-findings';
import type { Checklist } from '../../../../../shared/rules';

/**
 * The author's calc editor. The form is replaced as a whole on load, restore, "take theirs" and unit
 * change; every edit flows (debounced) through the shared engine and rule set in the browser, is kept
 * locally, and reaches the server only through the explicit, versioned "Save revision".
 */
@Component({
  selector: 'tt-revision-editor',
  imports: [
    RouterLink,
    MatButtonModule,
    MatButtonToggleModule,
    MatIconModule,
    MatProgressBarModule,
    StateBadge,
    MaterialPanel,
    SegmentsTable,
    FeaturesList,
    SupportsPanel,
    LoadsPanel,
    ForcesPanel,
    DynamicsPanel,
    FatiguePanel,
    NotesPanel,
    LiveResults,
    LiveDetails,
    VerdictStrip,
    InputFindings,
  ],
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
  private lastConversion: Conversion | null = null;
  // The empty form's value until the stored input has passed the debounce: not an edit by the author.
  private readonly placeholder = this.form().getRawValue();
  private readonly value = toSignal(
    toObservable(this.form).pipe(
      switchMap((f) =>
        f.valueChanges.pipe(
          startWith(null),
          map(() => f.getRawValue()),
        ),
      ),
      this.debounceMs > 0 ? debounceTime(this.debounceMs) : identity,
    ),
    { initialValue: this.placeholder },
  );

  protected readonly authorValue = this.value;
  protected readonly authorInput = computed(() => valueToInput(this.value()));
  protected readonly live = liveCalc(this.authorInput, this.store.ruleSet);
  protected readonly issueMap = computed(() => toIssueMap(this.live.issues()));
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
  protected readonly criterionName = computed(() => this.store.ruleSet()?.methods.fatigueCriterion ?? 'DE-Goodman');
  protected readonly criterion = computed(() => CRITERION_KEYS[this.criterionName()] ?? 'goodman');
  protected readonly readyChecklist = computed(() => {
    const c = this.live.checklist();
    return c.kind === 'ready' ? c : null;
  });
  /** The stored verdict shows with the stored input at once; the live one replaces it once evaluated. */
  protected readonly verdictState = computed((): ChecklistState | StoredChecklist => {
    const live = this.live.checklist();
    const stored = this.revision()?.checklist as Checklist | null | undefined;
    const isEdited = this.value() !== this.placeholder && this.isDirty();
    return live.kind === 'none' && stored && !isEdited ? { kind: 'stored', checklist: stored } : live;
  });
  /** Findings anchored to an input (not to a checklist clause), shown beside their fields. */
  protected readonly inputFindings = computed(() =>
    (this.revision()?.findings ?? []).filter((f) => f.anchorPath && !f.clauseRef),
  );
  protected readonly limits = computed(() => {
    const ev = this.live.evaluated();
    const c = this.live.checklist();
    return ev && c.kind === 'ready' ? plotLimits(c.checklist, c.ruleSet, ev.result) : undefined;
  });

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
    effect(() => applyIssues(this.form(), this.live.issues()));
    effect(() => {
      const f = this.form();
      if (this.canEdit()) f.enable({ emitEvent: false });
      else f.disable({ emitEvent: false });
    });
  }

  protected replaceForm(v: EditorValue): void {
    this.units.set(v.units);
    this.form.set(editorForm(v));
  }

  /** Converts every entered value to the other system (engine unit helpers), never just relabels it. */
  protected switchUnits(to: UnitSystem): void {
    const v = this.form().getRawValue();
    if (v.units === to) return;
    const { value, conversion } = switchUnits(v, to, this.lastConversion);
    this.lastConversion = conversion;
    this.replaceForm(value);
  }

  /**
   * On leaving a numeric field, "1e3" becomes "1000": written back through the field's own input
   * event, so whichever control is bound (form group or standalone) takes the same value it had.
   */
  protected showPlainNumber(event: FocusEvent): void {
    const field = event.target;
    if (!(field instanceof HTMLInputElement) || field.getAttribute('inputmode') !== 'decimal') return;
    const plain = plainDecimal(field.value);
    if (plain === null || plain === field.value) return;
    field.value = plain;
    field.dispatchEvent(new Event('input', { bubbles: true }));
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
