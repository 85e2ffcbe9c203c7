/**
 * The statistics layer of Evenload: pure, synchronous functions over `readonly number[]` and
 * normalised runs. One function per file; this index re-exports them by topic.
 */

// Errors
export { StatsError } from './stats-error';

// Descriptive statistics and scatter
export { mean } from './mean';
export { sampleVariance } from './sample-variance';
export { sampleStandardDeviation } from './sample-standard-deviation';
export { coefficientOfVariation } from './coefficient-of-variation';
export { valueExtent } from './value-extent';
export { rangeOverMean } from './range-over-mean';
export { largestDeviationFromMean } from './largest-deviation-from-mean';
export { largestDeviationFromTarget } from './largest-deviation-from-target';
export { shareWithinBand } from './share-within-band';
export { quantile } from './quantile';
export { quantileSorted } from './quantile-sorted';
export { lagOneAutocorrelation } from './lag-one-autocorrelation';
export { tighteningFactor } from './tightening-factor';
export { threeSigmaOverMean } from './three-sigma-over-mean';

// Capability
export { processCapability, type ProcessCapabilityResult } from './process-capability';

// Runs: final loads, passes, elastic interaction
export { finalLoads } from './final-loads';
export { loadsAfterEachPass, type PassSnapshot } from './loads-after-each-pass';
export { elasticInteractionDrift, type StudDrift } from './elastic-interaction-drift';
export { lossPerPass, type PassLoss } from './loss-per-pass';
export {
  interactionCoefficients,
  type InteractionAtDistance,
  type InteractionCoefficientsResult,
} from './interaction-coefficients';
export { summariseRun, type RunSummary } from './summarise-run';

// Comparison of groups
export { oneWayAnova, type OneWayAnovaResult } from './one-way-anova';
export { welchAnova, type WelchAnovaResult } from './welch-anova';
export { welchTTest, type WelchTTestResult } from './welch-t-test';
export { leveneTest, type LeveneTypeResult } from './levene-test';
export { brownForsytheTest } from './brown-forsythe-test';
export { bartlettTest, type BartlettTestResult } from './bartlett-test';
export { varianceRatioTest, type VarianceRatioTestResult } from './variance-ratio-test';
export { tukeyHsd, type TukeyHsdComparison, type TukeyHsdResult } from './tukey-hsd';
export { cvConfidenceInterval, type CvConfidenceIntervalResult } from './cv-confidence-interval';
export { gamesHowell, type GamesHowellComparison, type GamesHowellResult } from './games-howell';
export { holmAdjust } from './holm-adjust';
export { cvRatioFromLogCv, type CvRatioResult } from './cv-ratio-from-log-cv';
export { varianceComponents, type VarianceComponentsResult } from './variance-components';
export { varianceComponentsFromSummaries, type VarianceRunSummary } from './variance-components-from-summaries';
export { runsPerGroupForCvRatio, type RunsPerGroupResult } from './runs-per-group-for-cv-ratio';
export { readStatisticalResult, type ReadableResult, type ReadingOptions } from './read-statistical-result';

// Mixed model (trainees as blocks)
export { randomInterceptModel, type RandomInterceptModelResult } from './random-intercept-model';
export { randomInterceptModels } from './random-intercept-models';
export { likelihoodRatioTest, type LikelihoodRatioTestResult } from './likelihood-ratio-test';

// Regression and nut factor
export { multipleLinearRegression, type LinearRegressionResult } from './multiple-linear-regression';
export { regressionThroughOrigin } from './regression-through-origin';
export { nutFactor, type NutFactorResult } from './nut-factor';

// Gauge calibration
export { calibrationFactor, type CalibrationFactorResult } from './calibration-factor';
export { linearityError } from './linearity-error';
export { hysteresisError, type HysteresisLevel } from './hysteresis-error';

// Distribution functions
export { fUpperTail } from './f-upper-tail';
export { studentTUpperTail } from './student-t-upper-tail';
export { chiSquareUpperTail } from './chi-square-upper-tail';
export { studentizedRangeUpperTail } from './studentized-range-upper-tail';
export { studentTQuantile } from './student-t-quantile';
export { chiSquareQuantile } from './chi-square-quantile';
export { studentizedRangeQuantile } from './studentized-range-quantile';
