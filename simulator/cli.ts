import { formatStats } from './client/stats';
import { buildFleetNodes } from './runner/build-nodes';
import { HELP, parseCliArgs, type CliConfig } from './runner/cli-options';
import { startFleet, type Fleet, type FleetStats } from './runner/fleet';
import { writeProgress } from './runner/progress';

// npm run simulate -- --help. A device fleet speaking only the public ingest contract.

const MINUTE_MS = 60_000;

function describeStats(s: FleetStats): string {
  return `[sim] ${s.simAt.toISOString()} ${s.live ? 'live' : 'replay'} · ${s.nodes} nodes · ${formatStats(s.totals)}`;
}

async function main(): Promise<void> {
  let cfg: CliConfig | 'help';
  try {
    cfg = parseCliArgs(process.argv.slice(2));
  } catch (e) {
    console.error(`simulate: ${(e as Error).message} (see npm run simulate -- --help)`);
    process.exit(2);
  }
  if (cfg === 'help') {
    console.log(HELP);
    return;
  }
  const built = buildFleetNodes(cfg);
  for (const note of built.notes) console.log(`[sim] ${note}`);
  console.log(`[sim] posting to ${cfg.baseUrl} at speed ${cfg.speed} (catch-up: ${cfg.catchUp})${cfg.durationSeconds !== undefined ? ` for ${cfg.durationSeconds} s` : ''}`);

  let lastLineMs = Date.now();
  const saveProgress = (fleet: Fleet) => {
    if (built.progress) writeProgress({ file: built.progress.file, fleetNow: built.progress.fleetNow, nodes: fleet.doneThrough() });
  };
  const fleet = startFleet({
    nodes: built.nodes, baseUrl: cfg.baseUrl, speed: cfg.speed, catchUp: cfg.catchUp, durationSeconds: cfg.durationSeconds,
    drainSeconds: cfg.drainSeconds, sender: { timeoutMs: cfg.timeoutSeconds * 1000 },
    onTick: (f) => {
      if (Date.now() - lastLineMs < MINUTE_MS) return;
      lastLineMs = Date.now();
      console.log(describeStats(f.stats()));
      saveProgress(f);
    },
  });

  const finish = (final: FleetStats, code: number) => {
    saveProgress(fleet);
    console.log(describeStats(final));
    if ((cfg as CliConfig).json) console.log(JSON.stringify({ final: { ...final.totals, simAt: final.simAt, nodes: final.nodes } }));
    process.exit(code);
  };
  let stopping = false;
  const onSignal = (signal: NodeJS.Signals) => {
    if (stopping) process.exit(1); // a second Ctrl-C: leave now
    stopping = true;
    console.log(`[sim] ${signal}: stopping (queued readings are not sent)`);
    // In-flight posts are aborted: the server stores a batch whole or not at all.
    fleet.stop({ drainSeconds: 0 }).then((final) => finish(final, 0), () => process.exit(1));
  };
  process.on('SIGINT', onSignal);
  process.on('SIGTERM', onSignal);
  const final = await fleet.done;
  if (!stopping) finish(final, 0);
}

main().catch((e) => {
  console.error(`simulate: ${(e as Error).message}`);
  process.exit(1);
});
