import { Injectable, computed, inject, signal } from '@angular/core';
import type { RuleSet } from '../../../../../shared/rules';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { assertApiFailure } from '../../../core/http/api-failure';
import { loadFailureText } from '../../../ui/load-failure';
import { CalcsApi } from '../calcs-api';

export type SaveOutcome =
  | { kind: 'saved'; revision: RevisionDto }
  | { kind: 'conflict'; current: RevisionDto }
  | { kind: 'failed'; message: string };

/**
 * Server state of one revision being edited: the stored revision, its rule set, the lockVersion the
 * author's edits started from, and the explicit save. Provided per editor page, so it resets on leave.
 * The revision is loaded once with a plain GET (not a resource that might refetch underneath the form).
 */
@Injectable()
export class EditorStore {
  private readonly api = inject(CalcsApi);

  private readonly stored = signal<RevisionDto | null>(null);
  readonly revision = this.stored.asReadonly();
  readonly ruleSet = signal<RuleSet | null>(null);
  readonly ruleSetProblem = signal<string | null>(null);
  readonly loadError = signal<string | null>(null);
  readonly isSaving = signal(false);
  /** lockVersion the current edits are based on; a save sends it and the server refuses a stale one. */
  readonly baseLockVersion = signal(0);

  // Keyed on the calc id alone, so a save (a new revision object) does not fetch the heading again.
  private readonly calcId = computed(() => this.stored()?.calcId);
  readonly calc = this.api.calc(this.calcId);
  readonly calcLabel = computed(() =>
    this.calc.hasValue() ? `${this.calc.value().number} · ${this.calc.value().title}` : '',
  );

  async load(id: number): Promise<void> {
    this.loadError.set(null);
    try {
      const revision = await this.api.getRevision(id);
      this.adopt(revision);
      // Not awaited: the stored input and verdict go on screen now; the live checklist follows the standard.
      void this.loadRuleSet(revision.ruleSet.id, `${revision.ruleSet.code} v${revision.ruleSet.version}`);
    } catch (error) {
      assertApiFailure(error);
      this.loadError.set(loadFailureText(error, `revision ${id}`));
    }
  }

  private async loadRuleSet(id: number, name: string): Promise<void> {
    try {
      // The schema is fetched beside the standard, not before the editor's first view.
      const [{ ruleSetSchema }, stored] = await Promise.all([
        import('../../../../../shared/rules/rule-set-schema'),
        this.api.getRuleSet(id),
      ]);
      const parsed = ruleSetSchema.safeParse(stored.document);
      this.ruleSet.set(parsed.success ? parsed.data : null);
      this.ruleSetProblem.set(
        parsed.success ? null : `The design standard ${name} could not be read, so no checklist is shown.`,
      );
    } catch (error) {
      assertApiFailure(error);
      this.ruleSetProblem.set(`The design standard ${name} could not be loaded: ${error.message}`);
    }
  }

  /** Makes `revision` the stored state the editor works from (after load, save or "take theirs"). */
  adopt(revision: RevisionDto): void {
    this.stored.set(revision);
    this.baseLockVersion.set(revision.lockVersion);
  }

  /** Saves `input` against the base lockVersion (or `lockVersion` when saving over a newer one knowingly). */
  async save(input: Record<string, unknown>, lockVersion = this.baseLockVersion()): Promise<SaveOutcome> {
    const r = this.stored();
    if (!r) return { kind: 'failed', message: 'The revision is not loaded yet.' };
    this.isSaving.set(true);
    try {
      const saved = await this.api.save(r.id, { input, lockVersion });
      this.adopt(saved);
      return { kind: 'saved', revision: saved };
    } catch (error) {
      assertApiFailure(error);
      const current = error.status === 409 ? (error.details['current'] as RevisionDto | undefined) : undefined;
      if (current) return { kind: 'conflict', current };
      const fields = Object.keys(error.fieldErrors).length ? error.lines() : [];
      return { kind: 'failed', message: [error.message, ...fields].join(' — ') };
    } finally {
      this.isSaving.set(false);
    }
  }
}
