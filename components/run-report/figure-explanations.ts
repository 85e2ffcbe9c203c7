/** One-line explanations of the run figures, in the lab's own words (shown on hover and to trainees). */
export const FIGURE_EXPLANATIONS = {
  mean: 'The average final stud load.',
  sd: 'Standard deviation: the typical distance of a stud’s final load from the average.',
  cv: 'Coefficient of variation: SD divided by the mean. The lower it is, the more evenly the studs are loaded.',
  rangeOverMean: 'Highest minus lowest final load, divided by the mean: the full spread in one number.',
  largestDeviation: 'How far the stud furthest from the target ended, in % of the target.',
  shareWithinBand: 'The share of studs whose final load lies inside the band (target ± tolerance).',
  cp: 'Cp: the band’s width divided by six SDs. Above 1, the scatter would fit inside the band if centred.',
  cpk: 'Cpk: like Cp, but it also counts how far the mean sits from the target. Above 1 is good.',
} as const;
