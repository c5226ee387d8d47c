/**
 * Scoring a take against a drill: the batch scorer, the live scorer and the windows they use.
 */
export { createLiveScorer } from './live-scorer';
export { scoreTake } from './score-take';
export { expectedTimeMs, FREE_BAND, type ScoringWindows, scoringWindows } from './windows';
