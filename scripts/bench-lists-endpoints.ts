// The list and read endpoints the list benchmark drives, each with the addresses it cycles through.
import type { Session } from './bench-http';
import { REVISION_FORM_HEADER, STORED_FORM } from '../shared/schemas/revision-form';

export interface BenchPeople {
  compliance: Session;
  worker: Session;
  auditorId: number;
  projects: number[];
  revisions: number[];
  deep: string;
}

const search = (words: string[], extra = '') =>
  words.map((w) => `/api/calcs?q=${encodeURIComponent(w)}&size=50${extra}`);

/**
 * The search rows name the share of the 100,000 calcs each word matches (titles are built from
 * 8 machines × 10 parts, 8 of the parts ending in the word "shaft"), so broad and rare words are
 * both measured; every one is a first page, counted.
 */
export function endpointsOf(b: BenchPeople): [string, Session, string[]][] {
  const { compliance, projects } = b;
  const asBrowser: Session = { ...compliance, headers: { [REVISION_FORM_HEADER]: STORED_FORM } };
  const p = (i: number) => projects[i % projects.length];
  return [
    // Not a target: the smallest answer behind sign-in (session, user, ability, CSRF token; one small query), the
    // floor under every line below on this machine.
    ['for scale · GET /api/session (no list)', compliance, ['/api/session']],
    ['calc list · project, newest first', compliance, projects.map((id) => `/api/calcs?projectId=${id}&size=50`)],
    [
      'calc list · project + state, by number',
      compliance,
      projects.map(
        (id, i) =>
          `/api/calcs?projectId=${id}&status=${['approved', 'draft', 'in_check'][i % 3]}&sort=number&dir=asc&size=50`,
      ),
    ],
    [
      'calc list · whole library, by title',
      compliance,
      ['asc', 'desc'].map((d) => `/api/calcs?sort=title&dir=${d}&size=50`),
    ],
    [
      'calc list · 20th page by keyset',
      compliance,
      [`/api/calcs?projectId=${p(7)}&size=50${b.deep ? `&after=${b.deep}` : ''}`],
    ],
    ['search · "shaft" (80 %), newest first', compliance, search(['shaft'])],
    [
      'search · "shaft" (80 %), by title / number',
      compliance,
      [...search(['shaft'], '&sort=title&dir=asc'), ...search(['shaft'], '&sort=number&dir=desc')],
    ],
    ['search · pulley / Ashdown / Returned (8–20 %)', compliance, search(['pulley', 'Ashdown', 'Returned'])],
    ['search · two words (mixer agitator, pulley Ashdown)', compliance, search(['mixer agitator', 'pulley Ashdown'])],
    ['search · numbers (KFD-B03-0000, DRG-4)', compliance, search(['KFD-B03-0000', 'DRG-4'])],
    ['search · one or two letters (s, dr)', compliance, search(['s', 'dr'])],
    [
      'search · "shaft" in a project, in a state',
      compliance,
      projects.map((id, i) => `/api/calcs?projectId=${id}&q=shaft${i % 2 ? '&status=approved' : ''}&size=50`),
    ],
    // The overview reads every queue's first page at the size the screen shows (src/app/features/calcs/calcs-api.ts,
    // QUEUE_PAGE); a queue's own pages go up to 25 rows. Until 4 December 2026 this line read 50 rows per queue.
    ['queues · overview (author + checker, 5 each)', b.worker, ['/api/dashboard/queues?size=5']],
    [
      'queues · one queue, 25 a page (waiting for my check)',
      b.worker,
      ['/api/dashboard/queues/awaiting-my-check?size=25'],
    ],
    ['projects', compliance, ['/api/projects?size=50']],
    ['audit list · newest', compliance, ['/api/audit?size=50']],
    [
      'audit list · by project / calc / person',
      compliance,
      projects
        .slice(0, 10)
        .flatMap((id, i) => [
          `/api/audit?projectId=${id}&size=50`,
          `/api/audit?userId=${b.auditorId + i}&size=50`,
          `/api/audit?action=revision.signed&projectId=${p(i + 3)}&size=50`,
        ]),
    ],
    ['standards library', compliance, ['/api/rule-sets']],
    // As the browser reads it (result and checklist as stored, expanded in the page: shared/schemas/revision-form.ts),
    // then in full as other API readers get it. Until 5 December 2026 the one line read it in full.
    ['one revision with results and checklist', asBrowser, b.revisions.map((id) => `/api/revisions/${id}`)],
    ['one revision in full (API readers)', compliance, b.revisions.map((id) => `/api/revisions/${id}`)],
  ];
}
