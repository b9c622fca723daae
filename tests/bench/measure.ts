import { execSync } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';

/**
 * The app server processes of this run: node processes running serve.ts with PORT = APP_URL's
 * port (so another stack on the machine is not counted), its workers when APP_WORKERS > 1;
 * the tsx launcher in front of them is not counted.
 */
export function appPids(port = Number(new URL(process.env.APP_URL ?? 'http://127.0.0.1:3000').port)): string[] {
  let pids: string[] = [];
  try {
    pids = execSync('pgrep -f "lib/server/serve.ts"', { encoding: 'utf8' }).trim().split('\n').filter(Boolean);
  } catch {
    return [];
  }
  return pids.filter((pid) => {
    try {
      const environ = readFileSync(`/proc/${pid}/environ`, 'utf8').split('\0');
      return environ.includes(`PORT=${port}`) && !readFileSync(`/proc/${pid}/cmdline`, 'utf8').includes('.bin/tsx');
    } catch {
      return false; // process gone
    }
  });
}

/** Resident memory (MB) of the app server of this run, summed over its processes. */
export function appRssMb(pids = appPids()): number {
  if (!pids.length) return NaN;
  let total = 0;
  for (const pid of pids) {
    try {
      const m = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
      if (m) total += Number(m[1]) / 1024;
    } catch {
      /* process gone */
    }
  }
  return total;
}

export function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

export async function timed<T>(fn: () => Promise<T>): Promise<{ ms: number; value: T }> {
  const t0 = performance.now();
  const value = await fn();
  return { ms: performance.now() - t0, value };
}

/** Samples the app's memory every 250 ms while `work` runs; returns the peak. */
export async function withPeakRss<T>(work: () => Promise<T>): Promise<{ value: T; peakMb: number; startMb: number }> {
  // The processes are looked up once: a pgrep every 250 ms would take CPU from the run it measures.
  const pids = appPids();
  const startMb = appRssMb(pids);
  let peakMb = startMb;
  const timer = setInterval(() => { peakMb = Math.max(peakMb, appRssMb(pids)); }, 250);
  try {
    return { value: await work(), peakMb, startMb };
  } finally {
    clearInterval(timer);
  }
}

/** Replaces the README's block between `<!-- name:start -->` and `<!-- name:end -->` with `text`. */
export function writeReadmeBlock(name: string, text: string): void {
  const readme = readFileSync('README.md', 'utf8');
  const start = `<!-- ${name}:start -->`;
  const end = `<!-- ${name}:end -->`;
  if (!readme.includes(start) || !readme.includes(end)) return;
  writeFileSync('README.md', readme.slice(0, readme.indexOf(start) + start.length) + `\n${text}\n` + readme.slice(readme.indexOf(end)));
}
