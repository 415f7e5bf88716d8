import type { SignalKey } from '../schemas/review-health.schema';

export interface SignalText {
  title: string;
  /** What the signal observes, worded as a fact. */
  meaning: string;
  /** What it cannot tell: every signal has innocent explanations. */
  limits: string;
}

/** Screen and CSV share these words, so the export explains itself the way the screen does. */
export const SIGNAL_TEXTS: Record<SignalKey, SignalText> = {
  'quick-check': {
    title: 'Short checks for the size of the calc',
    meaning: 'Checks signed sooner after submission than the set seconds per checklist row, segment and feature.',
    limits:
      'The clock runs from the last submission: a checker may have read the calc earlier, or the revision may differ little from one already checked.',
  },
  'no-findings': {
    title: 'Checkers with no findings recorded',
    meaning:
      'Checkers who signed at least the set number of checks in the period without raising a finding on any of them.',
    limits: 'Good calcs deserve no findings, and questions settled in conversation leave no record here.',
  },
  pairing: {
    title: 'One checker for most of an author’s checks',
    meaning: 'Authors whose checked revisions in the period were mostly checked by one person, above the set share.',
    limits:
      'Small teams and specialist work often leave one qualified checker; the share says nothing of how each check was done.',
  },
  refusals: {
    title: 'Signatures refused',
    meaning:
      'Signing attempts refused, per person and revision, with each reason counted: a wrong password, a one-time code missing, wrong or not set up; several attempts are marked repeated.',
    limits: 'Mistyped passwords and expired codes are common; a refusal means nothing was signed.',
  },
  'attachments-after-check': {
    title: 'Attachments changed between check and approval',
    meaning:
      'Approved revisions whose attachment set at approval differs from the set the checker’s signature covered.',
    limits:
      'Adding a certificate after the check is allowed and often right; the approver’s signature covers the files it saw.',
  },
  'replaced-standard': {
    title: 'Approved close to a change of standard',
    meaning:
      'Revisions approved under a standard version that was replaced within the set number of days after the approval, or before it.',
    limits:
      'The date the next version took effect is fixed in advance; approval near it may simply be the project’s schedule.',
  },
  'verdict-flip': {
    title: 'Verdict differs under the current standard',
    meaning:
      'Approved revisions that would get another verdict if re-evaluated under the version of their standard in force today.',
    limits:
      'The approval was judged under the version in force then; a changed verdict asks for a review, not a finding against anyone.',
  },
};

export const HEALTH_CAUTION =
  'These signals are facts drawn from the record to help decide what to look at; they judge no person. Results support, ' +
  'never replace, the judgement of a qualified engineer; local codes and licensed practice govern.';
