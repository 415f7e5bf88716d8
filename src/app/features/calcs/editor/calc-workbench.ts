import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import type { UnitSystem } from '../../../../../shared/engine';
import type { Checklist, RuleSet } from '../../../../../shared/rules';
import type { FindingDto } from '../../../../../shared/schemas/calc-dto';
import type { EditorForm, EditorValue } from './editor-form';
import { valueToInput } from './form-to-input';
import { toIssueMap } from './issue-map';
import { applyIssues } from './apply-issues';
import { liveCalc, type ChecklistState } from './live-calc';
import { plotLimits } from './plot-limits';
import { CRITERION_KEYS } from './result-format';
import { plainDecimal } from './number-text';
import { switchUnits, type Conversion } from './unit-convert';
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
import { VerdictStrip, type StoredChecklist } from './verdict-strip';
import { InputFindings } from './input-findings';
import { PanelPacer } from './panel-pacer';
import { PanelPlaceholder } from './panel-placeholder';
import { placeholderHeights } from './placeholder-heights';

/**
 * The calc editor's inputs beside their live results, plots and checklist, for a form its page owns: the
 * checker's independent model is built here with the same panels, engine and standard as the author's calc.
 * The page keeps loading, saving and the form itself; a unit switch hands it the converted value (`replace`).
 */
@Component({
  selector: 'tt-calc-workbench',
  imports: [
    MatButtonToggleModule,
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
    PanelPlaceholder,
  ],
  providers: [PanelPacer],
  templateUrl: './calc-workbench.html',
  styleUrl: './calc-workbench.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CalcWorkbench {
  readonly form = input.required<EditorForm>();
  /** The form's (debounced) value. */
  readonly value = input.required<EditorValue>();
  /** The form's unit system, at once (the value follows after the debounce). */
  readonly units = input.required<UnitSystem>();
  readonly canEdit = input(false);
  readonly ruleSet = input<RuleSet | null>(null);
  readonly ruleSetProblem = input<string | null>(null);
  /** The checklist stored with the revision, shown until the live one is ready (null once the input is edited). */
  readonly storedChecklist = input<Checklist | null>(null);
  /** Findings anchored to an input (not to a checklist clause), shown beside their fields. */
  readonly inputFindings = input<readonly FindingDto[]>([]);
  readonly notesLabel = input('Notes for the checker');
  /** A whole new form value: the entered values converted to the other unit system. */
  readonly replace = output<EditorValue>();
  private lastConversion: Conversion | null = null;
  protected readonly pacer = inject(PanelPacer);

  protected readonly calcInput = computed(() => valueToInput(this.value()));
  protected readonly live = liveCalc(this.calcInput, this.ruleSet);
  /** Room kept for each panel not yet built, from its number of rows, so nothing below it jumps. */
  protected readonly heights = computed(() => placeholderHeights(this.form()));
  protected readonly issueMap = computed(() => toIssueMap(this.live.issues()));
  protected readonly criterionName = computed(() => this.ruleSet()?.methods.fatigueCriterion ?? 'DE-Goodman');
  protected readonly criterion = computed(() => CRITERION_KEYS[this.criterionName()] ?? 'goodman');
  protected readonly readyChecklist = computed(() => {
    const c = this.live.checklist();
    return c.kind === 'ready' ? c : null;
  });
  /** The stored verdict shows with the stored input at once; the live one replaces it once evaluated. */
  protected readonly verdictState = computed((): ChecklistState | StoredChecklist => {
    const live = this.live.checklist();
    const stored = this.storedChecklist();
    return live.kind === 'none' && stored ? { kind: 'stored', checklist: stored } : live;
  });
  protected readonly limits = computed(() => {
    const ev = this.live.evaluated();
    const c = this.live.checklist();
    return ev && c.kind === 'ready' ? plotLimits(c.checklist, c.ruleSet, ev.result) : undefined;
  });

  constructor() {
    effect(() => applyIssues(this.form(), this.live.issues()));
    effect(() => {
      const f = this.form();
      if (this.canEdit()) f.enable({ emitEvent: false });
      else f.disable({ emitEvent: false });
    });
  }

  /** Converts every entered value to the other system (engine unit helpers), never just relabels it. */
  protected switchUnits(to: UnitSystem): void {
    const v = this.form().getRawValue();
    if (v.units === to) return;
    const { value, conversion } = switchUnits(v, to, this.lastConversion);
    this.lastConversion = conversion;
    this.replace.emit(value);
  }

  /** On leaving a numeric field, "1e3" becomes "1000", written back through the field's own input event. */
  protected showPlainNumber(event: FocusEvent): void {
    const field = event.target;
    if (!(field instanceof HTMLInputElement) || field.getAttribute('inputmode') !== 'decimal') return;
    const plain = plainDecimal(field.value);
    if (plain === null || plain === field.value) return;
    field.value = plain;
    field.dispatchEvent(new Event('input', { bubbles: true }));
  }
}
