import { DEFAULT_THRESHOLDS, type MarginState, type StateThresholds } from './types';

/** Node state from its night margin; dark/silent/new come from history, not from here. */
export function stateFromMargin({
  margin,
  thresholds = DEFAULT_THRESHOLDS,
}: {
  margin: number;
  thresholds?: StateThresholds;
}): MarginState {
  if (margin >= thresholds.steady) return 'steady';
  if (margin >= thresholds.thin) return 'thin';
  return 'short';
}
