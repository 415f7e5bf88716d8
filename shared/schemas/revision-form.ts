import type { RevisionDto } from './calc-dto';
import { expandStoredResult, metadataNeeded, type EngineMetadata, type StoredResult } from '../engine/stored-result';
import { decodeChecklist, type StoredChecklist } from '../rules/stored-checklist';

/*
 * A revision read can be answered with its result and checklist as they are stored (units and formulas left to the
 * engine version, checklist texts written once: about half the bytes, and nothing for the server to build and
 * serialise again). The browser asks for that form by this request header and builds the full read itself (the
 * client's revision-form interceptor); other readers of the API, asking nothing, are answered in full as before.
 */
export const REVISION_FORM_HEADER = 'Revision-Form';
export const STORED_FORM = 'stored';

/** The two forms of a revision read: `full` unless the reader asks for `stored`. */
export type RevisionForm = 'full' | typeof STORED_FORM;

/** The reads that honour the header: one revision, and a calc's newest; and a save's answer (PUT of a revision). */
export const STORED_FORM_PATH = /^\/api\/(?:revisions\/\d+|calcs\/\d+\/latest-revision)$/;
export const STORED_FORM_SAVE_PATH = /^\/api\/revisions\/\d+$/;

/** A revision read in the stored form. */
export type StoredRevisionDto = Omit<RevisionDto, 'result' | 'checklist'> & {
  result: StoredResult | null;
  checklist: StoredChecklist | null;
};

/** The engine version whose metadata the read needs to be expanded, or null when it needs none. */
export function metadataVersionOf(read: StoredRevisionDto): string | null {
  return read.result ? metadataNeeded(read.result) : null;
}

/** The read as the full form gives it: deep-equal to what the server answers without the header. */
export function expandRevision(read: StoredRevisionDto, meta: EngineMetadata | null): RevisionDto {
  const version = metadataVersionOf(read);
  if (version !== null && !meta) throw new Error(`The units and formulas of engine ${version} are needed to show it`);
  return {
    ...read,
    result: read.result && (version === null ? read.result : expandStoredResult(read.result, meta!)),
    checklist: read.checklist && decodeChecklist(read.checklist),
  };
}
