import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  linkedSignal,
  numberAttribute,
} from '@angular/core';
import { Router, RouterLink } from '@angular/router';
import { MatTabsModule } from '@angular/material/tabs';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { Checklist } from '../../../../../shared/rules';
import type { CalcResult } from '../../../../../shared/engine';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { SessionStore } from '../../../core/auth/session-store';
import { LoadFailure } from '../../../ui/load-failure';
import { SafetyNote } from '../../../ui/safety-note';
import { StateBadge } from '../../../ui/state-badge';
import { VerdictBadge } from '../../../ui/verdict-badge';
import { ChecklistTable } from '../checklist/checklist-table';
import { CalcsApi } from '../calcs-api';
import { FindingsPanel } from './findings-panel';
import { SignaturesPanel } from './signatures-panel';
import { RevisionHistory } from './revision-history';
import { AttachmentsPanel } from './attachments-panel';
import { RecordExports } from './record-exports';
import { ManualItems } from './manual-items';
import { countFindings, findingsTabLabel } from './finding-counts';
import { failingMandatoryRows, failingRowText } from './signing-readiness';
import { featureTypesOf, placeOf } from '../../../../../shared/format';
import { planActions, type RevisionAction } from './revision-actions';
import type { SignDialogData } from './sign-dialog';
import type { ReasonKind } from './reason-texts';
import { WorkflowDialogs } from './workflow-dialogs';
import { ResultsTab } from './results-tab';
import { IndependentModelPanel } from './independent-model-panel';

@Component({
  selector: 'tt-calc-page',
  imports: [
    IndependentModelPanel,
    RouterLink,
    MatTabsModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    SafetyNote,
    StateBadge,
    VerdictBadge,
    ChecklistTable,
    FindingsPanel,
    SignaturesPanel,
    RevisionHistory,
    AttachmentsPanel,
    RecordExports,
    ManualItems,
    ResultsTab,
    LoadFailure,
  ],
  providers: [WorkflowDialogs],
  templateUrl: './calc-page.html',
  styleUrl: './calc-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class CalcPage {
  private readonly api = inject(CalcsApi);
  private readonly dialogs = inject(WorkflowDialogs);
  private readonly router = inject(Router);
  protected readonly me = inject(SessionStore).user;

  readonly id = input.required({ transform: numberAttribute });
  readonly rev = input<number | undefined, unknown>(undefined, {
    transform: (v) => (v == null ? undefined : Number(v)),
  });

  protected readonly calc = this.api.calc(this.id);
  protected readonly calcInfo = computed(() => (this.calc.hasValue() ? this.calc.value() : undefined));
  protected readonly selectedId = linkedSignal(() => this.rev() ?? this.calcInfo()?.latest.id);
  protected readonly revision = this.api.revisionOf(this.id, this.rev);
  protected readonly current = linkedSignal<RevisionDto | undefined>(() =>
    this.revision.hasValue() ? this.revision.value() : undefined,
  );
  /**
   * The revision is being read again (after an attachment or a model changed its signed content): until the fresh
   * copy arrives, a signature would be made against the old content hash and refused, so the actions wait.
   */
  protected readonly refreshing = computed(() => this.revision.isLoading() && this.current() !== undefined);
  protected readonly isLatest = computed(() => this.current()?.id === this.calcInfo()?.latest.id);
  protected readonly plan = computed(() => {
    const r = this.current();
    if (!r) return null;
    // An archived project is a closed record: the server refuses every write, so nothing is offered.
    if (this.calcInfo()?.projectArchived)
      return { actions: new Set<RevisionAction>(), nextStep: 'Nothing more happens here: the project is archived.' };
    return planActions(r, this.me(), this.isLatest());
  });
  protected readonly checklist = computed(() => (this.current()?.checklist ?? null) as Checklist | null);
  protected readonly result = computed(() => (this.current()?.result ?? null) as CalcResult | null);
  protected readonly canTick = computed(() => !!this.plan()?.actions.has('sign-checked'));
  protected readonly failingMandatory = computed(() => (this.current() ? failingMandatoryRows(this.current()!) : []));
  protected readonly failingRowText = failingRowText;
  /** An input issue's place in the editor's words (Segment 3, hole ⌀), features by their tags. */
  protected readonly inputPlace = (path: string) => placeOf(path, featureTypesOf(this.current()?.input));
  protected readonly findingsLabel = computed(() =>
    findingsTabLabel(countFindings(this.current() ?? { findings: [] })),
  );

  protected select(revisionId: number): void {
    void this.router.navigate([], { queryParams: { rev: revisionId }, replaceUrl: true });
  }

  protected updated(r: RevisionDto): void {
    this.current.set(r);
    this.calc.reload();
  }

  protected sign(meaning: SignDialogData['meaning']): void {
    const revision = this.current()!;
    const calcLabel = `${this.calcInfo()?.number} rev ${revision.label}`;
    this.dialogs.sign(revision, meaning, calcLabel, (signed) => this.updated(signed));
  }

  protected askReason(kind: ReasonKind): void {
    this.dialogs.askReason(
      kind,
      () => this.current(),
      (r) => this.updated(r),
    );
  }
}
