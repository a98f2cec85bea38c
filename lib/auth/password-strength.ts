import "server-only";
import { ZxcvbnFactory } from "@zxcvbn-ts/core";
import * as common from "@zxcvbn-ts/language-common";
import * as english from "@zxcvbn-ts/language-en";

/**
 * The password policy beyond length (NIST SP 800-63B §5.1.1.2): no composition rules, but a new
 * password is refused when it is a common or breached-list password, a keyboard walk, a repetition or
 * built from the account's own name, address or the product's name. zxcvbn estimates how many guesses
 * an attacker needs; score 3 means about 10^8 to 10^10 guesses, the level its authors give for an
 * account protected by a slow hash (bcrypt here).
 */
export const minimumStrengthScore = 3;

let estimator: ZxcvbnFactory | undefined;

function strengthEstimator(): ZxcvbnFactory {
  estimator ??= new ZxcvbnFactory({
    dictionary: { ...common.dictionary, ...english.dictionary },
    graphs: common.adjacencyGraphs,
    translations: english.translations,
  });
  return estimator;
}

/** Words an attacker who knows the account would try first. */
const productWords = ["arcwright", "lensing", "einstein", "telescope", "proposal"];

/** Null when the password is strong enough, else the reason in words, for the form's password field. */
export function passwordWeakness(password: string, account: { email?: string; name?: string }): string | null {
  const nameWords = account.name?.toLowerCase().split(/\s+/) ?? [];
  const accountWords = [account.email, account.email?.split("@")[0], ...nameWords, nameWords.join("")];
  const inputs = [...productWords, ...accountWords.filter((w): w is string => !!w)];
  const result = strengthEstimator().check(password, inputs);
  if (result.score >= minimumStrengthScore) return null;
  const reason = result.feedback.warning ?? "This password is too easy to guess.";
  const hint = result.feedback.suggestions[0] ?? "Use a few uncommon words together.";
  return `${reason} ${hint}`;
}
