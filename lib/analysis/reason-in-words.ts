/**
 * Why a statistic could not be computed, in words for the compare page. The statistics functions
 * (lib/stats) throw messages named for programmers ("randomInterceptModel requires some variation
 * within clusters"); the page says what the data lacks instead, with the clusters of the mixed
 * model named as what they are here: operators.
 */
const KNOWN: readonly [RegExp, string][] = [
  [/requires some variation within clusters/, 'within each operator the runs are all alike or all in one group, so operators cannot be told apart from the groups'],
  [/requires at least two clusters/, 'it needs runs from at least two operators'],
  [/requires more observations than clusters/, 'it needs more runs than operators'],
  [/requires predictors that are not collinear/, 'the groups and attempt numbers go together too closely to be told apart'],
];

export function reasonInWords(error: unknown): string {
  const message = error instanceof Error ? error.message : String(error);
  for (const [pattern, words] of KNOWN) if (pattern.test(message)) return words;
  // Any other "<function> requires …": keep what is required, drop the function's name.
  return message.replace(/^[a-z][A-Za-z]+ requires /, 'it needs ');
}
