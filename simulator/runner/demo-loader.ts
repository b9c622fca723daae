import { readFileSync } from 'node:fs';
import path from 'node:path';
import { generateDemoHistory } from '../fleet/demo-fleet';
import type { FleetNode } from './fleet';
import { readProgress } from './progress';

// The demo fleet as the seed left it: the same physics, rebuilt from the seed's `now` and
// seed number and the cadences the seed chose (generateDemoHistory is deterministic), so the
// live run continues each story.

export interface DemoFleetFile { now: string; seed: number; cadences?: Record<string, number>; slugs: Record<string, string> }

export function readJsonFile<T>(file: string): T {
  try {
    return JSON.parse(readFileSync(file, 'utf8')) as T;
  } catch (e) {
    throw new Error(`cannot read ${file}: ${(e as Error).message} (has the demo been seeded? npm run demo does it)`);
  }
}

export function loadDemoFleet({ dataDir, only, progressFile }: { dataDir: string; only?: string[]; progressFile?: string }): {
  fleetNow: Date; nodes: FleetNode[]; skipped: string[];
} {
  const fleet = readJsonFile<DemoFleetFile>(path.join(dataDir, 'demo-fleet.json'));
  const tokens = readJsonFile<Record<string, string>>(path.join(dataDir, 'device-tokens.json'));
  const fleetNow = new Date(fleet.now);
  if (Number.isNaN(fleetNow.getTime())) throw new Error(`demo-fleet.json: "now" is not a time: ${fleet.now}`);
  const history = generateDemoHistory({ now: fleetNow, seed: fleet.seed, cadences: fleet.cadences ?? {} });
  const done = progressFile ? readProgress({ file: progressFile, fleetNow: fleet.now }) : {};
  const nodes: FleetNode[] = [];
  const skipped: string[] = [];
  for (const [nodeId, slug] of Object.entries(fleet.slugs)) {
    if (only && !only.includes(slug)) continue;
    const sim = history[slug]?.node;
    const token = tokens[nodeId];
    if (!sim || !token) {
      skipped.push(`${slug} (${!sim ? 'not in the demo fleet' : 'no device token'})`);
      continue;
    }
    nodes.push({ nodeId, token, label: slug, sim, sendAfter: done[nodeId] ?? fleetNow });
  }
  return { fleetNow, nodes, skipped };
}
