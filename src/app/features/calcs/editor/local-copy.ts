import { signal } from '@angular/core';
import type { DraftStorage, LocalDraft } from './draft-storage';
import { canonical } from './editor-support';
import { inputToValue } from './form-values';
import { valueToInput } from './form-to-input';

/**
 * An editing session's copy in this browser (draft-storage.ts): kept on every change unless it equals
 * the stored revision, and offered for restore when the editor opens a revision it differs from.
 */
export class LocalCopy {
  readonly offer = signal<LocalDraft | null>(null);
  readonly note = signal<string | null>(null);
  private revisionId = 0;

  constructor(private readonly drafts: DraftStorage) {}

  /** The revision whose copy this is, set before that revision loads. */
  follow(revisionId: number): void {
    this.revisionId = revisionId;
  }

  /** Offers the kept copy when it differs from the stored revision's canonical input. */
  offerIfDifferent(baseline: string): void {
    const draft = this.drafts.read(this.revisionId);
    const draftText = draft ? canonical(valueToInput(inputToValue(draft.input))) : null;
    this.offer.set(draft && draftText !== baseline ? draft : null);
  }

  /** Writes `input` as the copy; a copy equal to the stored revision is dropped instead. */
  keep(input: Record<string, unknown>, baseline: string, lockVersion: number): void {
    if (canonical(input) === baseline) {
      this.clear();
      return;
    }
    const ok = this.drafts.write(this.revisionId, { lockVersion, savedAt: new Date().toISOString(), input });
    this.note.set(ok ? null : 'This browser refused to keep a local copy (storage full or blocked): save soon.');
  }

  clear(): void {
    this.drafts.clear(this.revisionId);
  }

  /** The copy on offer, taken off offer. */
  take(): LocalDraft | null {
    const d = this.offer();
    this.offer.set(null);
    return d;
  }

  discard(): void {
    this.clear();
    this.offer.set(null);
  }
}
