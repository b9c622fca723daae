import { evaluateNode } from '@/lib/energy';
import { problems } from '@/lib/errors';
import { memberRoute } from '@/lib/http/route';
import { evaluateBody, evaluateInputFromWire, evaluateProblems, evaluationToWire } from '@/lib/schemas/evaluate';

// The energy model for one node as posted: no database, any signed-in member. The state uses
// the default thresholds (steady ≥ 1.5, thin ≥ 1.0); an organization's own thresholds apply
// where the server evaluates stored nodes.
export const POST = memberRoute({ permission: 'model:evaluate', body: evaluateBody }, async ({ body }) => {
  const input = evaluateInputFromWire(body);
  const bad = evaluateProblems(input);
  if (bad.length) throw problems.invalid(bad);
  return Response.json(evaluationToWire(evaluateNode(input)), { headers: { 'cache-control': 'no-store' } });
});
