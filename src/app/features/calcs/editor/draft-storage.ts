import { Injectable } from '@angular/core';

export interface LocalDraft {
  /** The stored revision's lockVersion the edits started from: saving it later is checked against that. */
  lockVersion: number;
  savedAt: string;
  input: Record<string, unknown>;
}

const KEY = (revisionId: number) => `torquetrail.draft.revision.${revisionId}`;

/**
 * The editor's safety net: every change is kept in this browser's localStorage per revision, so a
 * reload, a crash or a lost session never loses work. Cleared after a successful save.
 */
@Injectable({ providedIn: 'root' })
export class DraftStorage {
  read(revisionId: number): LocalDraft | null {
    try {
      const raw = globalThis.localStorage?.getItem(KEY(revisionId));
      if (!raw) return null;
      const d = JSON.parse(raw) as Partial<LocalDraft>;
      const isValid =
        typeof d.lockVersion === 'number' && typeof d.savedAt === 'string' && !!d.input && typeof d.input === 'object';
      return isValid ? (d as LocalDraft) : null;
    } catch {
      // Private mode or a corrupted entry: behave as if there were no copy rather than break the editor.
      return null;
    }
  }

  write(revisionId: number, draft: LocalDraft): boolean {
    try {
      globalThis.localStorage?.setItem(KEY(revisionId), JSON.stringify(draft));
      return true;
    } catch {
      return false;
    }
  }

  clear(revisionId: number): void {
    try {
      globalThis.localStorage?.removeItem(KEY(revisionId));
    } catch {
      // Nothing to clear when storage is unavailable.
    }
  }
}
