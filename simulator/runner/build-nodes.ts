import path from 'node:path';
import type { CliConfig } from './cli-options';
import { loadDemoFleet, readJsonFile } from './demo-loader';
import type { FleetNode } from './fleet';
import { buildGenericNodes } from './generic-fleet';

// The nodes a command line asks for: the seeded demo fleet, or N generic nodes.

export interface BuiltFleet { nodes: FleetNode[]; notes: string[]; progress?: { file: string; fleetNow: string } }

export function buildFleetNodes(cfg: CliConfig, nowMs = Date.now()): BuiltFleet {
  if (cfg.mode === 'demo') {
    const progressFile = path.join(cfg.dataDir, 'simulator-progress.json');
    const demo = loadDemoFleet({ dataDir: cfg.dataDir, only: cfg.only, progressFile });
    const notes = [`demo fleet seeded up to ${demo.fleetNow.toISOString()}`];
    if (demo.skipped.length) notes.push(`skipped: ${demo.skipped.join(', ')}`);
    if (cfg.only) for (const slug of cfg.only) if (!demo.nodes.some((n) => n.label === slug)) notes.push(`--only ${slug}: no such demo node`);
    return { nodes: demo.nodes, notes, progress: { file: progressFile, fleetNow: demo.fleetNow.toISOString() } };
  }
  const tokens = readJsonFile<Record<string, string>>(cfg.tokensFile!);
  const ids = Object.keys(tokens).slice(0, cfg.nodeCount);
  if (ids.length < cfg.nodeCount) throw new Error(`${cfg.tokensFile} holds ${ids.length} tokens; --nodes asks for ${cfg.nodeCount}`);
  // By default an accelerated, bounded run replays the stretch that ends now.
  const replaySeconds = cfg.durationSeconds !== undefined && cfg.speed > 1 ? cfg.durationSeconds * cfg.speed : 0;
  const startAt = cfg.startAt ?? new Date(nowMs - replaySeconds * 1000);
  const sims = buildGenericNodes({ count: ids.length, seed: cfg.seed, latDeg: cfg.latDeg, lonDeg: cfg.lonDeg, startAt });
  const nodes = sims.map((sim, i) => ({ nodeId: ids[i], token: tokens[ids[i]], label: sim.spec.slug, sim }));
  const notes = [`${nodes.length} generic nodes from ${startAt.toISOString()} at ${cfg.latDeg}°, ${cfg.lonDeg}°`];
  if (cfg.speed > 1 && startAt.getTime() >= nowMs) notes.push('--speed has no past to replay: give --start or --duration-seconds');
  return { nodes, notes };
}
