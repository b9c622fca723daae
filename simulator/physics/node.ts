import { applyJoules, createBankPhysics, type BankPhysics } from './bank';
import { runReportCycle } from './burst';
import { getEfficiency } from './converter';
import { createRandom, hashSeed } from './prng';
import { makeSimReading } from './reading';
import { getClearSkyIrradiance, getRefractionDegrees, getSunElevationRadians } from './sun';
import { DEFAULT_FAULTS, type SimFaults, type SimNodeSpec, type SimNodeState, type SimReading } from './types';
import { createWeather, type Weather } from './weather';

// One node stepped in time: panel → charger → bank → boost converter → load cycle.

export interface SimNodeOptions {
  seed: number;
  startAt: Date;
  initialVolts: number;
  /** Keep the panel dark (for discharge checks). */
  noSun?: boolean;
  /** Share one sky between the nodes of a site; default: a sky of the node's own seed. */
  weather?: Weather;
  /** Seconds until the first report; default a seeded fraction of the interval. */
  firstReportAfterSeconds?: number;
}

export interface SimStepResult { readings: SimReading[]; brownouts: Date[]; restarts: Date[] }


export class SimNode {
  readonly spec: SimNodeSpec;
  readonly faults: SimFaults;
  readonly bank: BankPhysics;
  private readonly random: () => number;
  private readonly weather: Weather;
  private readonly noSun: boolean;
  private tMs: number;
  private volts: number;
  private running: boolean;
  private seq = 0;
  private brownouts = 0;
  private restarts = 0;
  private undelivered = 0;
  private intervalSeconds: number;
  private nextReportMs: number;

  constructor(spec: SimNodeSpec, opts: SimNodeOptions) {
    this.spec = spec;
    this.faults = { ...DEFAULT_FAULTS, ...spec.faults };
    this.bank = createBankPhysics({ bank: spec.bank, charger: spec.charger, faults: this.faults });
    this.random = createRandom(hashSeed(opts.seed, 7));
    this.weather = opts.weather ?? createWeather({ seed: hashSeed(opts.seed, 3), lonDeg: spec.site.lonDeg });
    this.noSun = opts.noSun ?? false;
    this.tMs = opts.startAt.getTime();
    this.volts = opts.initialVolts;
    // A node found below its start voltage is off until the sun lifts it there.
    this.running = opts.initialVolts >= spec.converter.startVolts;
    this.intervalSeconds = spec.load.intervalSeconds;
    const firstSeconds = opts.firstReportAfterSeconds ?? this.random() * this.intervalSeconds;
    this.nextReportMs = this.tMs + firstSeconds * 1000;
  }

  get state(): SimNodeState {
    return {
      at: new Date(this.tMs), volts: this.volts, running: this.running, seq: this.seq,
      brownouts: this.brownouts, restarts: this.restarts, undelivered: this.undelivered,
      nextReportAt: new Date(this.nextReportMs), intervalSeconds: this.intervalSeconds,
    };
  }

  /** Cadence advice from the server: clamp to the node's own range. */
  setIntervalSeconds(seconds: number): void {
    const { maxIntervalSeconds } = this.spec.load;
    this.intervalSeconds = Math.min(maxIntervalSeconds, Math.max(1, Math.round(seconds)));
  }

  /** Irradiance on the panel now, W/m², after clouds, shade and dirt. */
  getPanelIrradiance(at: Date): number {
    const lost = this.faults.panelLostFrom && at >= this.faults.panelLostFrom;
    if (this.noSun || lost) return 0;
    const { latDeg, lonDeg, horizonDeg = 0 } = this.spec.site;
    const elevationRadians = getSunElevationRadians({ at, latDeg, lonDeg });
    if (horizonDeg > 0 && elevationRadians < ((horizonDeg + getRefractionDegrees(horizonDeg)) * Math.PI) / 180) return 0;
    const clear = getClearSkyIrradiance({ elevationRadians });
    if (clear === 0) return 0;
    return clear * this.weather.getCloudFactor(at) * this.faults.shadingFactor * this.faults.dirtFactor;
  }

  step(dtSeconds: number): SimReading[] {
    return this.stepDetailed(dtSeconds).readings;
  }

  stepDetailed(dtSeconds: number): SimStepResult {
    const result: SimStepResult = { readings: [], brownouts: [], restarts: [] };
    const endMs = this.tMs + dtSeconds * 1000;
    while (this.tMs < endMs) {
      const untilMs = this.running ? Math.min(endMs, this.nextReportMs) : endMs;
      this.advanceContinuous({ seconds: (untilMs - this.tMs) / 1000, result });
      this.tMs = untilMs;
      if (this.running && this.tMs >= this.nextReportMs) this.report(result);
    }
    return result;
  }

  /** Charge, sleep draw and leakage over a stretch with no report in it. */
  private advanceContinuous({ seconds, result }: { seconds: number; result: SimStepResult }): void {
    if (seconds <= 0) return;
    const mid = new Date(this.tMs + seconds * 500);
    const { panel, charger, converter, load } = this.spec;
    const panelWatts = (panel.ratedWatts * this.getPanelIrradiance(mid)) / 1000;
    const charging = this.volts < this.bank.chargeVolts && panelWatts > 0;
    const chargeWatts = charging
      ? Math.min(charger.efficiency * panelWatts, charger.chargeLimitAmps * Math.max(this.volts, 0.05))
      : 0;
    let loadWatts = 0;
    if (this.running) {
      const stuck = this.faults.stuckAwakeFrom && mid >= this.faults.stuckAwakeFrom;
      const amps = stuck ? (this.faults.stuckAwakeAmps ?? load.awakeAmps) : load.sleepAmps;
      loadWatts = (converter.outputVolts * amps) / getEfficiency({ efficiency: converter.efficiency, inputVolts: this.volts });
    }
    const leakWatts = this.volts * this.bank.leakageAmps(this.volts);
    let volts = applyJoules({ farads: this.bank.farads, volts: this.volts, joules: (chargeWatts - loadWatts - leakWatts) * seconds });
    // The charger regulates at its charge voltage instead of overshooting it.
    if (charging && volts > this.bank.chargeVolts) volts = this.bank.chargeVolts;
    this.volts = volts;
    const at = new Date(this.tMs + seconds * 1000);
    if (this.running && volts < converter.cutoffVolts) this.goDark({ at, result });
    else if (!this.running && volts >= converter.startVolts) this.restart({ at, result });
  }

  private report(result: SimStepResult): void {
    const at = new Date(this.nextReportMs);
    const restingVolts = this.volts;
    const cycle = runReportCycle({ volts: restingVolts, bank: this.bank, converter: this.spec.converter, load: this.spec.load });
    this.volts = cycle.volts;
    this.nextReportMs += this.intervalSeconds * 1000;
    if (!cycle.ok) {
      this.goDark({ at, result });
      return;
    }
    this.seq += 1;
    if (this.faults.linkFaultFrom && at >= this.faults.linkFaultFrom) {
      this.undelivered += 1;
      return;
    }
    result.readings.push(makeSimReading({
      spec: this.spec, at, restingVolts, seq: this.seq, irradiance: this.getPanelIrradiance(at), random: this.random,
    }));
  }

  private goDark({ at, result }: { at: Date; result: SimStepResult }): void {
    this.running = false;
    this.brownouts += 1;
    result.brownouts.push(at);
  }

  private restart({ at, result }: { at: Date; result: SimStepResult }): void {
    this.running = true;
    this.restarts += 1;
    this.seq = 0; // the counter lives in RAM and starts over after a brownout
    // After a brownout reset the firmware sleeps one interval before it tries the radio again,
    // letting the bank recover (common practice); otherwise it would reboot-loop at dawn.
    this.nextReportMs = at.getTime() + this.intervalSeconds * 1000;
    result.restarts.push(at);
  }
}
