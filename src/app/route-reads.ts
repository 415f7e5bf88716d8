import type { PrefetchReads } from './core/http/route-prefetch';
import { QUEUE_PAGE } from './features/calcs/calcs-api';

/*
 * The first reads of the screens that are opened most, started as soon as their route is known (RoutePrefetch).
 * Each URL must be exactly the one the page itself asks for (path and query), or the page simply reads again.
 */
const isId = (v: string | undefined): v is string => !!v && /^[1-9]\d{0,9}$/.test(v);

/** The overview: its hand-overs and the first page of every queue. */
export const overviewReads: PrefetchReads = () => ['/api/dashboard', `/api/dashboard/queues?size=${QUEUE_PAGE}`];

/** A calc's page: the calc beside the revision shown (the one in `?rev=`, else the newest). */
export const calcPageReads: PrefetchReads = ({ id }, { rev }) => {
  if (!isId(id)) return [];
  return [`/api/calcs/${id}`, isId(rev) ? `/api/revisions/${rev}` : `/api/calcs/${id}/latest-revision`];
};

/** The editor: the revision, then its calc's heading and its design standard. */
export const editorReads: PrefetchReads = ({ id }) =>
  isId(id)
    ? [
        {
          url: `/api/revisions/${id}`,
          then: (body) => {
            const r = body as { calcId?: number; ruleSet?: { id?: number } } | null;
            return [r?.calcId && `/api/calcs/${r.calcId}`, r?.ruleSet?.id && `/api/rule-sets/${r.ruleSet.id}`].filter(
              (u): u is string => !!u,
            );
          },
        },
      ]
    : [];
