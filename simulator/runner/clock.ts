// The simulated clock: `speed` simulated seconds per wall second, and never ahead of the wall
// clock, because the server refuses readings more than 5 minutes in its future (DESIGN.md §5 /
// issue 5). An accelerated run therefore replays the past and then goes on in real time.

export interface SimClock {
  nowMs(): number;
  /** True once the simulated time has caught up with the wall clock. */
  isLive(): boolean;
}

export function createSimClock({ fromMs, speed, wallNow = Date.now }: { fromMs: number; speed: number; wallNow?: () => number }): SimClock {
  const wallStartMs = wallNow();
  const nowMs = () => {
    const wall = wallNow();
    return Math.min(wall, fromMs + speed * (wall - wallStartMs));
  };
  return { nowMs, isLive: () => nowMs() >= wallNow() };
}
