// Which fertilizer rule set to propose for a property, from its state. Rule sets carry no state of
// their own: a rule set is for a state when its name names that state ("New Jersey turf fertilizer
// law" is New Jersey's). The longest state name found wins, so "West Virginia …" is West
// Virginia's, not Virginia's. The form proposes; the manager may still choose another.
import { findUsState, US_STATES, type UsState } from "@/lib/reference/us-states";

export interface RuleSetChoice {
  id: string;
  name: string;
}

export type RuleSetProposal =
  | { kind: "state"; ruleSetId: string; ruleSetName: string; state: UsState; reason: string }
  | { kind: "none"; state: UsState; reason: string };

const wordsOf = (s: string) => ` ${s.toLowerCase().replace(/[^a-z]+/g, " ")} `;

/** The state a rule set's name names, or undefined. */
export function stateOfRuleSet(name: string): UsState | undefined {
  const words = wordsOf(name);
  let best: UsState | undefined;
  for (const s of US_STATES)
    if (words.includes(wordsOf(s.name)) && (!best || s.name.length > best.name.length)) best = s;
  return best;
}

/** The proposal for a state code, or null while the state is not a known code. */
export function proposeRuleSet(
  ruleSets: readonly RuleSetChoice[],
  stateCode: string,
): RuleSetProposal | null {
  const state = findUsState(stateCode);
  if (!state) return null;
  const match = ruleSets.find((r) => stateOfRuleSet(r.name)?.code === state.code);
  if (match)
    return {
      kind: "state",
      ruleSetId: match.id,
      ruleSetName: match.name,
      state,
      reason: `Proposed because the property is in ${state.name} and “${match.name}” is the company's rule set for ${state.name}. You can choose another.`,
    };
  return {
    kind: "none",
    state,
    reason: `No rule set here is for ${state.name}. Check ${state.name}'s fertilizer law and choose the closest rule set, or add one under Rule sets.`,
  };
}
