import { longestNight, nightAfter, planBank } from '@/lib/energy';
import { problems } from '@/lib/errors';
import { memberRoute } from '@/lib/http/route';
import { curveStepSeconds, planInputFromWire, planProblems, planToWire, plannerBody } from '@/lib/schemas/planner';

// The sizing planner (fields documented in lib/schemas/planner.ts): pure computation, no
// database, any signed-in member.
export const POST = memberRoute({ permission: 'planner:use', body: plannerBody }, async ({ body }) => {
  const input = planInputFromWire(body);
  const bad = planProblems(input);
  if (bad.length) throw problems.invalid(bad);
  // The curve's spacing follows the window, which is known only once the night is found; the
  // night search is a few tens of milliseconds, so it is simply done here first as well.
  const { site } = input;
  const night = input.date ? nightAfter({ site, date: input.date }) : longestNight({ site, year: input.year ?? new Date().getUTCFullYear() });
  const windowSeconds = night.seconds + (input.extraDays ?? 0) * 86_400;
  const plan = planBank({ ...input, curveStepSeconds: curveStepSeconds(windowSeconds) });
  return Response.json(planToWire(plan, input), { headers: { 'cache-control': 'no-store' } });
});
