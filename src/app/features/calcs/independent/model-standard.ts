import { computed, type Signal } from '@angular/core';
import { ruleSetSchema, type RuleSet } from '../../../../../shared/rules';
import type { RuleSetDto } from '../../../../../shared/schemas/rule-set.schema';

/** The design standard the independent model is checked against, or why no checklist can be shown. */
export function modelStandard(read: { hasValue(): boolean; value(): RuleSetDto | undefined }): {
  ruleSet: Signal<RuleSet | null>;
  problem: Signal<string | null>;
} {
  const parsed = computed(() => (read.hasValue() ? ruleSetSchema.safeParse(read.value()!.document) : null));
  return {
    ruleSet: computed(() => (parsed()?.success ? parsed()!.data! : null)),
    problem: computed(() =>
      parsed()?.success === false ? 'The design standard could not be read, so no checklist is shown.' : null,
    ),
  };
}
