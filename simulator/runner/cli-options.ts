import { parseArgs } from 'node:util';

// The simulator's command line, parsed and checked before anything starts.

export const HELP = `Duskwatch simulator: solar-charged supercapacitor nodes posting through the ingest contract.

Usage:
  npm run simulate -- --demo [options]                 the demo fleet, continuing the seeded history
  npm run simulate -- --nodes N --tokens FILE [options]  N generic nodes (load tests)

Common options:
  --url URL              the Duskwatch app (default http://127.0.0.1:3000); nothing else is contacted
  --speed N              simulated seconds per real second (default 1). The simulated clock never
                         runs ahead of the real one (the server refuses readings more than 5 minutes
                         ahead), so a speed above 1 replays the past, then runs on in real time
  --duration-seconds S   stop by itself after S seconds of real time (default: run until Ctrl-C)
  --drain-seconds S      after --duration-seconds, wait up to S s for queued readings (default 10)
  --catch-up MODE        instant: step the gap up to now at once and send it as a backlog;
                         replay: play it at --speed (default: instant at speed 1, else replay)
  --timeout-seconds S    per request (default 10)
  --json                 print the final counters as one JSON line
  -h, --help             this text

Demo mode (--demo):
  --data-dir DIR         where the seed left demo-fleet.json and device-tokens.json (default .data/demo)
  --only SLUG,SLUG       only these demo nodes (e.g. qr-culvert-1,nf-stage-1)

Generic fleet (--nodes N --tokens FILE):
  --tokens FILE          JSON object {nodeId: device token}; the first N are used
  --seed N               varies banks, panels and cadences (default 1)
  --lat DEG --lon DEG    the site (default 47.1, -120.5)
  --start ISO            simulated start (default: speed × duration before now, or now)

Every node queues its readings and posts them as {"readings": [...]} (up to 1000 a post).
On 5xx, timeouts or no answer it keeps them and retries with backoff (Retry-After honoured);
on 429 it waits; on any other 4xx it logs the problem and drops that batch. A line of counters
is printed every minute. Ctrl-C (SIGINT) or SIGTERM stops at once; unsent readings are not kept.
`;

export interface CliConfig {
  mode: 'demo' | 'fleet';
  baseUrl: string;
  speed: number;
  durationSeconds?: number;
  drainSeconds: number;
  catchUp: 'instant' | 'replay';
  timeoutSeconds: number;
  json: boolean;
  dataDir: string;
  only?: string[];
  nodeCount: number;
  tokensFile?: string;
  seed: number;
  latDeg: number;
  lonDeg: number;
  startAt?: Date;
}

export function parseCliArgs(argv: string[]): CliConfig | 'help' {
  const { values: v } = parseArgs({
    args: argv,
    strict: true,
    options: {
      demo: { type: 'boolean' }, nodes: { type: 'string' }, tokens: { type: 'string' }, url: { type: 'string' },
      speed: { type: 'string' }, 'duration-seconds': { type: 'string' }, 'drain-seconds': { type: 'string' },
      'catch-up': { type: 'string' }, 'timeout-seconds': { type: 'string' }, json: { type: 'boolean' },
      'data-dir': { type: 'string' }, only: { type: 'string' }, seed: { type: 'string' }, lat: { type: 'string' },
      lon: { type: 'string' }, start: { type: 'string' }, help: { type: 'boolean', short: 'h' },
    },
  });
  if (v.help) return 'help';
  if (!v.demo === (v.nodes === undefined)) throw new Error('choose one: --demo, or --nodes N --tokens FILE (see --help)');
  if (v.nodes !== undefined && !v.tokens) throw new Error('--nodes needs --tokens FILE');
  const speed = readNumber('--speed', v.speed, 1, { min: 1 });
  const catchUp = v['catch-up'] ?? (speed > 1 ? 'replay' : 'instant');
  if (catchUp !== 'instant' && catchUp !== 'replay') throw new Error('--catch-up is instant or replay');
  const start = v.start === undefined ? undefined : new Date(v.start);
  if (start && Number.isNaN(start.getTime())) throw new Error(`--start is not a time: ${v.start}`);
  return {
    mode: v.demo ? 'demo' : 'fleet',
    baseUrl: readBaseUrl(v.url ?? 'http://127.0.0.1:3000'),
    speed,
    durationSeconds: v['duration-seconds'] === undefined ? undefined : readNumber('--duration-seconds', v['duration-seconds'], 0, { min: 0 }),
    drainSeconds: readNumber('--drain-seconds', v['drain-seconds'], 10, { min: 0 }),
    catchUp,
    timeoutSeconds: readNumber('--timeout-seconds', v['timeout-seconds'], 10, { min: 0.1 }),
    json: v.json ?? false,
    dataDir: v['data-dir'] ?? '.data/demo',
    only: v.only?.split(',').map((s) => s.trim()).filter(Boolean),
    nodeCount: v.nodes === undefined ? 0 : readNumber('--nodes', v.nodes, 0, { min: 1, integer: true }),
    tokensFile: v.tokens,
    seed: readNumber('--seed', v.seed, 1, { integer: true }),
    latDeg: readNumber('--lat', v.lat, 47.1, { min: -90, max: 90 }),
    lonDeg: readNumber('--lon', v.lon, -120.5, { min: -180, max: 180 }),
    startAt: start,
  };
}

function readNumber(name: string, text: string | undefined, fallback: number, o: { min?: number; max?: number; integer?: boolean }): number {
  if (text === undefined) return fallback;
  const n = Number(text);
  const bad = !Number.isFinite(n) || (o.integer && !Number.isInteger(n)) || (o.min !== undefined && n < o.min) || (o.max !== undefined && n > o.max);
  if (bad) throw new Error(`${name}: ${text} is not ${o.integer ? 'a whole number' : 'a number'}${o.min !== undefined ? ` ≥ ${o.min}` : ''}${o.max !== undefined ? ` ≤ ${o.max}` : ''}`);
  return n;
}

function readBaseUrl(text: string): string {
  let url: URL;
  try {
    url = new URL(text);
  } catch {
    throw new Error(`--url is not a URL: ${text}`);
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:') throw new Error('--url must be http:// or https://');
  return url.toString().replace(/\/+$/, '');
}
