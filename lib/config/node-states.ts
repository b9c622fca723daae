/** Node states (DESIGN.md §4): our own words, each with its meaning for the field. */
export const NODE_STATES = ['short', 'dark', 'thin', 'silent', 'new', 'steady'] as const;
export type NodeState = (typeof NODE_STATES)[number];

export const NODE_STATE_INFO: Record<NodeState, { label: string; meaning: string; riskRank: number }> = {
  short: { label: 'short', meaning: 'Projected to brown out before the next recharge.', riskRank: 0 },
  dark: { label: 'dark', meaning: 'Went quiet at or near the burst floor: presumed browned out.', riskRank: 1 },
  thin: { label: 'thin', meaning: 'Reaches recharge, with less than the comfortable margin.', riskRank: 2 },
  silent: { label: 'silent', meaning: 'Went quiet while healthy: link or firmware fault.', riskRank: 3 },
  new: { label: 'new', meaning: 'Not configured yet, or no readings so far.', riskRank: 4 },
  steady: { label: 'steady', meaning: 'Reaches recharge with a comfortable margin.', riskRank: 5 },
};
