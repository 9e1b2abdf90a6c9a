import { defineAbilityFor, type AbilityInput, type AppAbility } from '@heatfleet/domain';

// A member's ability depends only on their role and ids (the rules are the domain's code, so a new rule version
// is a new process and an empty cache). Building it costs more than the rest of authenticate; an ability is
// immutable once built (its conditions compile lazily and stay compiled), so one is shared by all requests.
const MAX_ENTRIES = 5_000;
const cache = new Map<string, AppAbility>();

/** The member's ability, built once per role and ids; least recently used entries leave past MAX_ENTRIES. */
export function abilityFor(input: Required<AbilityInput>): AppAbility {
  const key = `${input.role}:${input.firmId}:${input.userId}:${input.memberId}`;
  const hit = cache.get(key);
  if (hit) {
    cache.delete(key);
    cache.set(key, hit);
    return hit;
  }
  const built = defineAbilityFor(input);
  cache.set(key, built);
  if (cache.size > MAX_ENTRIES) cache.delete(cache.keys().next().value!);
  return built;
}
