// The cluster run's load: CLIENTS teams (author, checker, approver) sharing one count of sign-offs to do.
import { ApiClient, type Tally } from './client';
import { signOff } from './signoff';
import type { Ledger } from './signoff-steps';
import type { RunData } from './setup-data';

export interface Workload {
  /** Sign-offs completed so far, for the fault schedule to wait on. */
  completed(): number;
  /** Settles when every client has found no sign-off left to start. */
  done: Promise<void>;
}

/** Starts `clients` teams on `base`; each takes the next calc number until `signOffs` have been started. */
export function startWorkload(
  base: string,
  data: RunData,
  opts: { clients: number; signOffs: number; tally: Tally; ledger: Ledger },
): Workload {
  let completed = 0;
  let next = 0;
  const client = async (i: number) => {
    const team = {
      author: new ApiClient(base, opts.tally),
      checker: new ApiClient(base, opts.tally),
      approver: new ApiClient(base, opts.tally),
      password: data.password,
    };
    const names = data.teams[i];
    await team.author.signIn(names.author, data.password);
    await team.checker.signIn(names.checker, data.password);
    await team.approver.signIn(names.approver, data.password);
    while (next < opts.signOffs) {
      const n = ++next;
      await signOff(
        team,
        {
          projectId: data.projectId,
          ruleSetId: data.ruleSetId,
          input: data.input,
          number: `CL-${String(n).padStart(3, '0')}`,
        },
        opts.ledger,
      );
      completed++;
    }
  };
  const done = Promise.all(Array.from({ length: opts.clients }, (_v, i) => client(i))).then(() => undefined);
  return { completed: () => completed, done };
}
