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
import { MatDialog } from '@angular/material/dialog';
import { MatSnackBar } from '@angular/material/snack-bar';
import type { Checklist } from '../../../../../shared/rules';
import type { CalcResult } from '../../../../../shared/engine';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { SessionStore } from '../../../core/auth/session-store';
import { assertApiFailure } from '../../../core/http/api-failure';
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
import { SignDialog, type SignDialogData } from './sign-dialog';
import { ReasonDialog, type ReasonDialogResult } from './reason-dialog';
import { reasonDialogTexts, type ReasonKind } from './reason-texts';
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
  templateUrl: './calc-page.html',
  styleUrl: './calc-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class CalcPage {
  private readonly api = inject(CalcsApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
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
    this.dialog
      .open(SignDialog, { data: { revision, meaning, calcLabel } satisfies SignDialogData, width: '600px' })
      .afterClosed()
      .subscribe((signed?: RevisionDto) => {
        if (!signed) return;
        this.updated(signed);
        this.snackBar.open(`Signed as ${meaning}. The revision is now ${signed.status.replace('_', ' ')}.`, 'OK', {
          duration: 6000,
        });
      });
  }

  protected askReason(kind: ReasonKind): void {
    const open = (this.current()?.findings ?? []).filter((f) => f.status === 'open').map((f) => `F${f.id}`);
    this.dialog
      .open(ReasonDialog, { data: reasonDialogTexts(kind, open) })
      .afterClosed()
      .subscribe((answer?: ReasonDialogResult) => {
        if (answer) void this.applyReason(kind, answer.reason, answer.choice);
      });
  }

  private async applyReason(kind: ReasonKind, reason: string, carryAttachments: boolean): Promise<void> {
    const r = this.current()!;
    try {
      if (kind === 'new-revision') {
        const created = await this.api.newRevision(r.calcId, reason, carryAttachments);
        await this.router.navigate(['/revisions', created.id, 'edit']);
        return;
      }
      this.updated(
        kind === 'return'
          ? await this.api.returnToAuthor(r.id, reason, r.lockVersion)
          : await this.api.withdraw(r.id, reason, r.lockVersion),
      );
    } catch (error) {
      assertApiFailure(error);
      this.snackBar.open(error.message, 'OK', { duration: 8000 });
    }
  }
}
