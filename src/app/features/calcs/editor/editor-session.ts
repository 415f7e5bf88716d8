import { Injectable, effect, inject, signal, untracked, type Signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { MatDialog } from '@angular/material/dialog';
import { MatSnackBar } from '@angular/material/snack-bar';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import type { EditorForm, EditorValue } from './editor-form';
import { EditorStore, type SaveOutcome } from './editor-store';
import { DraftStorage } from './draft-storage';
import { canonical } from './editor-support';
import { inputToValue } from './form-values';
import { valueToInput } from './form-to-input';
import { LocalCopy } from './local-copy';
import { askConflict } from './conflict-dialog';
import { LeaveDialog, type LeaveChoice } from './leave-dialog';

export interface SessionHooks {
  form: () => EditorForm;
  replace: (v: EditorValue) => void;
  canEdit: Signal<boolean>;
  authorInput: Signal<Record<string, unknown>>;
}

/**
 * One editing session of a revision: what was loaded (the baseline), the local copy kept on every
 * change, the offer to restore it, and the explicit save with its conflict handling. Never overwrites
 * the stored revision silently: a stale save comes back as a 409 and the author decides.
 */
@Injectable()
export class EditorSession {
  private readonly store = inject(EditorStore);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly hooks = signal<SessionHooks | null>(null);
  private readonly local = new LocalCopy(inject(DraftStorage));

  readonly isLoaded = signal(false);
  /** Canonical input as stored on the server; anything else is an unsaved change. */
  readonly baseline = signal('');
  readonly restoreOffer = this.local.offer;
  readonly pendingConflict = signal<{ mine: Record<string, unknown>; current: RevisionDto } | null>(null);
  readonly saveError = signal<string | null>(null);
  readonly localNote = this.local.note;

  constructor() {
    // Autosave to this browser on every (debounced) change once the stored revision is on screen.
    effect(() => {
      const input = this.hooks()?.authorInput();
      if (input) untracked(() => this.keepLocalCopy(input));
    });
  }

  attach(hooks: SessionHooks): void {
    this.hooks.set(hooks);
  }

  private current(): Record<string, unknown> {
    return valueToInput(this.hooks()!.form().getRawValue());
  }

  private showStored(revision: RevisionDto): void {
    this.hooks()!.replace(inputToValue(revision.input));
    this.baseline.set(canonical(this.current()));
  }

  async open(id: number): Promise<void> {
    this.local.follow(id);
    this.isLoaded.set(false);
    await this.store.load(id);
    const revision = this.store.revision();
    if (!revision) return;
    this.showStored(revision);
    this.local.offerIfDifferent(this.baseline());
    this.isLoaded.set(true);
  }

  /** Writes the current input to localStorage; a copy equal to the stored revision is dropped instead. */
  keepLocalCopy(input: Record<string, unknown> = this.current()): void {
    // While a copy is offered for restore it must not be overwritten by what the form shows.
    if (!this.isLoaded() || !this.hooks()?.canEdit() || this.restoreOffer()) return;
    this.local.keep(input, this.baseline(), this.store.baseLockVersion());
  }

  restore(): void {
    const d = this.local.take();
    if (!d) return;
    // The copy keeps the version it started from, so saving it over newer work gives a 409, not an overwrite.
    this.store.baseLockVersion.set(d.lockVersion);
    this.hooks()!.replace(inputToValue(d.input));
  }

  discardLocal(): void {
    this.local.discard();
  }

  hasUnsavedChanges(): boolean {
    return this.isLoaded() && !!this.hooks()?.canEdit() && canonical(this.current()) !== this.baseline();
  }

  async save(): Promise<void> {
    const mine = this.current();
    await this.settle(await this.store.save(mine), mine);
  }

  private async settle(outcome: SaveOutcome, mine: Record<string, unknown>): Promise<void> {
    this.saveError.set(null);
    if (outcome.kind === 'failed') this.saveError.set(outcome.message);
    if (outcome.kind === 'conflict') await this.resolve(mine, outcome.current);
    if (outcome.kind !== 'saved') return;
    this.pendingConflict.set(null);
    this.baseline.set(canonical(mine));
    this.local.clear();
    // Edits typed while the save was in flight are kept as a new local copy.
    this.keepLocalCopy();
    this.snackBar.open(`Saved revision ${outcome.revision.label} (version ${outcome.revision.lockVersion}).`, 'OK', {
      duration: 4000,
    });
  }

  private async resolve(mine: Record<string, unknown>, current: RevisionDto): Promise<void> {
    this.pendingConflict.set({ mine, current });
    const choice = await askConflict(this.dialog, { mine, myBase: this.store.baseLockVersion(), theirs: current });
    if (choice === 'keep-mine') await this.settle(await this.store.save(mine, current.lockVersion), mine);
    if (choice === 'take-theirs') {
      this.pendingConflict.set(null);
      this.store.adopt(current);
      this.showStored(current);
      this.local.clear();
    }
  }

  reopenConflict(): void {
    const c = this.pendingConflict();
    if (c) void this.resolve(this.current(), c.current);
  }

  async confirmLeave(): Promise<boolean> {
    if (!this.hasUnsavedChanges()) return true;
    this.keepLocalCopy();
    const choice = await firstValueFrom(this.dialog.open<LeaveDialog, void, LeaveChoice>(LeaveDialog).afterClosed());
    if (choice === 'leave') return true;
    if (choice !== 'save') return false;
    // Leave only once the revision really holds the edits: a refusal or a conflict keeps the author here.
    await this.save();
    return !this.hasUnsavedChanges() && !this.saveError() && !this.pendingConflict();
  }
}
