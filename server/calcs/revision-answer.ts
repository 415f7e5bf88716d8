import type { Request, Response } from 'express';
import type { RevisionDto } from '../../shared/schemas/calc-dto';
import { REVISION_FORM_HEADER, STORED_FORM, type RevisionForm } from '../../shared/schemas/revision-form';

/**
 * A stored JSON text sent as it is, inside an answer: a revision's result or checklist in the stored form. The text
 * is parsed once here, so only a whole, valid JSON value is ever spliced into an answer (a row changed behind the
 * app's back to something that is not fails as the full read would, never as a broken or widened answer).
 */
export class StoredJson {
  constructor(
    readonly text: string,
    check = true,
  ) {
    if (check) JSON.parse(text);
  }

  /**
   * A text known to parse: the record hash was computed from this very text (its memo is keyed by a digest of every
   * text it parsed, and remembers only hashes computed without error).
   */
  static parsed(text: string): StoredJson {
    return new StoredJson(text, false);
  }
}

/** The form the reader asked for: the result and checklist as stored, or in full (shared/schemas/revision-form.ts). */
export function formOf(req: Request): RevisionForm {
  return req.get(REVISION_FORM_HEADER) === STORED_FORM ? 'stored' : 'full';
}

const textOf = (value: unknown): string => (value instanceof StoredJson ? value.text : JSON.stringify(value));

/**
 * Sends a revision read. In the stored form its result and checklist texts go out as stored, with the rest of the
 * read serialised around them; the key order differs from the full form's, the JSON value is the same.
 */
export function sendRevision(res: Response, read: RevisionDto): void {
  res.vary(REVISION_FORM_HEADER);
  if (!(read.result instanceof StoredJson) && !(read.checklist instanceof StoredJson)) {
    res.json(read);
    return;
  }
  const { result, checklist, ...rest } = read;
  const others = JSON.stringify(rest);
  const tail = others === '{}' ? '}' : `,${others.slice(1)}`;
  res.type('json').send(`{"result":${textOf(result)},"checklist":${textOf(checklist)}${tail}`);
}
