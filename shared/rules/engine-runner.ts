import type { Engine, Rule } from 'json-rules-engine';
import { errorText, failed, notApplicable, type ClauseOutcome } from './clause-outcome';
import { clauseRule, newEngine, resultsByName } from './clause-rules';
import type { Facts } from './facts';
import { preparedFor } from './prepared-rule-set';
import { RuleSetCache } from './rule-set-cache';
import { SCOPES, type RuleSet, type Scope } from './rule-set-schema';

/*
 * json-rules-engine path. One Engine per rule set and scope holds two rules per clause (applies,
 * check); one run per location evaluates them all. A run that rejects (a rule threw) is redone
 * clause by clause on single-rule engines, so only the clause at fault becomes "error".
 */

const MISSING = 'json-rules-engine returned no result for this rule';

export class RuleSetRunner {
  readonly #batch = new Map<Scope, { engine: Engine; clauses: number[] }>();
  readonly #single = new Map<string, Engine>();
  readonly #params: Facts;
  /** Clauses whose conditions json-rules-engine refused to build, with its reason. */
  readonly #broken = new Map<number, string>();
  // Engine.run keeps a status flag shared by all runs of one Engine; overlapping runs can make a
  // run skip its rules. Runs on this rule set are therefore queued, one at a time.
  #tail: Promise<unknown> = Promise.resolve();

  constructor(private readonly ruleSet: RuleSet) {
    this.#params = preparedFor(ruleSet).params;
    for (const scope of SCOPES) {
      const clauses = ruleSet.clauses.flatMap((c, i) => (c.scope === scope ? [i] : []));
      const rules = clauses.flatMap((i) => this.#rulesOf(i));
      this.#batch.set(scope, { engine: newEngine(this.#params, rules), clauses });
    }
  }

  #rulesOf(i: number): Rule[] {
    const clause = this.ruleSet.clauses[i];
    try {
      return [clauseRule(`${i}:a`, clause.applicability), clauseRule(`${i}:c`, clause.check)];
    } catch (err) {
      this.#broken.set(i, errorText(err));
      return [];
    }
  }

  /** Outcome of every clause of the scope at one location, keyed by clause index. */
  evaluate(scope: Scope, facts: Facts): Promise<Map<number, ClauseOutcome>> {
    const next = this.#tail.then(() => this.#evaluateNow(scope, facts));
    this.#tail = next.catch(() => undefined);
    return next;
  }

  async #evaluateNow(scope: Scope, facts: Facts): Promise<Map<number, ClauseOutcome>> {
    const { engine, clauses } = this.#batch.get(scope)!;
    const out = new Map<number, ClauseOutcome>();
    let byName: Map<string, boolean>;
    try {
      byName = resultsByName(await engine.run(facts));
    } catch {
      for (const i of clauses)
        out.set(i, this.#broken.has(i) ? failed(this.#broken.get(i), null) : await this.#isolated(i, facts));
      return out;
    }
    for (const i of clauses) {
      const broken = this.#broken.get(i);
      if (broken !== undefined) {
        out.set(i, failed(broken, null));
        continue;
      }
      const [applies, passes] = [byName.get(`${i}:a`), byName.get(`${i}:c`)];
      if (applies === undefined) out.set(i, failed(MISSING, null));
      else if (!applies) out.set(i, notApplicable());
      else if (passes === undefined) out.set(i, failed(MISSING, true));
      else out.set(i, { applies, passes, error: null });
    }
    return out;
  }

  async #isolated(i: number, facts: Facts): Promise<ClauseOutcome> {
    let applies: boolean;
    try {
      applies = await this.#runOne(`${i}:a`, facts);
    } catch (err) {
      return failed(err, null);
    }
    if (!applies) return notApplicable();
    try {
      return { applies, passes: await this.#runOne(`${i}:c`, facts), error: null };
    } catch (err) {
      return failed(err, true);
    }
  }

  async #runOne(name: string, facts: Facts): Promise<boolean> {
    let engine = this.#single.get(name);
    if (!engine) {
      const clause = this.ruleSet.clauses[Number(name.split(':')[0])];
      engine = newEngine(this.#params, [clauseRule(name, name.endsWith(':a') ? clause.applicability : clause.check)]);
      this.#single.set(name, engine);
    }
    const result = resultsByName(await engine.run(facts)).get(name);
    if (result === undefined) throw new Error(MISSING);
    return result;
  }
}

const RUNNERS = new RuleSetCache((ruleSet) => new RuleSetRunner(ruleSet));

/** The cached json-rules-engine runner of a rule set (built once per code + version and content). */
export function runnerFor(ruleSet: RuleSet): RuleSetRunner {
  return RUNNERS.get(ruleSet);
}
