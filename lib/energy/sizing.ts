// Sizing planner: how many cells in parallel a node needs to get through the longest night
// (or the night after a chosen date) plus extra sunless days with margin ≥ a target, and how
// long the bank takes to charge.
//
// Input (PlanInput): load, converter, cell {farads, ratedVolts, esrOhms, leakageAmps},
//   cellsSeries, site, date? (night after this date; default the year's longest night),
//   year? (for the default; this year), extraDays (0), targetMargin (1.5), panelWatts,
//   chargerEfficiency, sunFactor (0..1, the share of rated panel power expected),
//   chargerAmps, maxCellsParallel (1000), curveStepSeconds (600).
// Output (BankPlan):
//   cellsParallel          smallest count reaching the target, null if none up to the maximum
//   evaluatedCellsParallel the count the other figures are for (cellsParallel, else the maximum)
//   energyFullJoules       ½·C·V_max²
//   burstFloorVolts        of that bank
//   nightStart, nightSeconds   the night planned for (sunset, length)
//   windowSeconds          night + extra days: the span the bank must carry the node
//   nightDrawJoules        bank-side energy drawn over that window, starting full
//   margin                 reserve at full ÷ that draw
//   panelChargeSeconds     cutoff → full: ½C(V_max² − V_cut²) ÷ (panel W × charger η × sun factor),
//                          ignoring the node's own draw while charging
//   ccChargeSeconds        cutoff → full at constant current: C·(V_max − V_cut)/I
//   dischargeCurve         {t seconds from sunset, volts} over the window, starting full;
//                          it ends early where the bank reaches the burst floor; empty when
//                          burstBlocked
//   burstBlocked           null, or why no bank of these cells can finish one burst: even at
//                          full voltage with no ESR the converter would draw inputAmps (> its
//                          limitAmps), or the full bank would sag below the cutoff
import { energyJoules, modelBank } from './bank';
import { solveBurstFloor } from './burst';
import { buildDischargeTable, traceDischarge } from './discharge';
import { efficiencyAt, efficiencyBreakVolts, inputCurrentAmps } from './efficiency';
import { averageOutputWatts, bankWattsCurve } from './load';
import { marginOverWindow } from './margin';
import { longestNight, nightAfter } from './nights';
import type { BankModel, BankSpec, ConverterSpec, LoadSpec, SiteSpec } from './types';

export interface CellSpec {
  farads: number;
  ratedVolts: number;
  esrOhms: number;
  leakageAmps: number;
}

export interface PlanInput {
  load: LoadSpec;
  converter: ConverterSpec;
  cell: CellSpec;
  cellsSeries: number;
  site: SiteSpec;
  date?: Date;
  year?: number;
  extraDays?: number;
  targetMargin?: number;
  panelWatts: number;
  chargerEfficiency: number;
  sunFactor: number;
  chargerAmps: number;
  maxCellsParallel?: number;
  curveStepSeconds?: number;
}

export interface BankPlan {
  cellsParallel: number | null;
  evaluatedCellsParallel: number;
  energyFullJoules: number;
  burstFloorVolts: number;
  nightStart: Date | null;
  nightSeconds: number;
  windowSeconds: number;
  nightDrawJoules: number;
  margin: number;
  panelChargeSeconds: number;
  ccChargeSeconds: number;
  dischargeCurve: { t: number; volts: number }[];
  burstBlocked: BurstBlocked | null;
}

/** No cell count helps: the burst asks the converter for more than its input limit even from a full, ideal bank. */
export interface BurstBlocked {
  inputAmps: number;
  limitAmps: number;
  fullVolts: number;
}

export function planBank(input: PlanInput): BankPlan {
  const { load, converter, site } = input;
  const night = input.date
    ? nightAfter({ site, date: input.date })
    : longestNight({ site, year: input.year ?? new Date().getUTCFullYear() });
  const windowSeconds = night.seconds + (input.extraDays ?? 0) * 86_400;
  const target = input.targetMargin ?? 1.5;
  const maxParallel = input.maxCellsParallel ?? 1000;
  const assess = (np: number) => {
    const bank = modelBank({ bank: bankSpec(input, np) });
    const floorVolts = solveBurstFloor({ bank, converter, load }).volts;
    const result = marginOverWindow({ bank, converter, load, volts: bank.maxVolts, windowSeconds, floorVolts });
    return { bank, floorVolts, ...result };
  };
  const cellsParallel = smallestPassing({ passes: (np) => assess(np).margin >= target, max: maxParallel });
  const chosen = assess(cellsParallel ?? maxParallel);
  const cutoff = converter.cutoffVolts;
  const { farads, maxVolts } = chosen.bank;
  const burstBlocked = cellsParallel === null ? burstLimit({ converter, load, fullVolts: maxVolts }) : null;
  return {
    cellsParallel,
    evaluatedCellsParallel: cellsParallel ?? maxParallel,
    energyFullJoules: energyJoules({ farads, volts: maxVolts }),
    burstFloorVolts: chosen.floorVolts,
    nightStart: night.start,
    nightSeconds: night.seconds,
    windowSeconds,
    nightDrawJoules: chosen.drawJoules,
    margin: chosen.margin,
    panelChargeSeconds:
      (0.5 * farads * (maxVolts ** 2 - cutoff ** 2)) / (input.panelWatts * input.chargerEfficiency * input.sunFactor),
    ccChargeSeconds: (farads * (maxVolts - cutoff)) / input.chargerAmps,
    dischargeCurve: burstBlocked ? [] : curveFromFull({ bank: chosen.bank, converter, load, floorVolts: chosen.floorVolts, windowSeconds, stepSeconds: input.curveStepSeconds ?? 600 }),
    burstBlocked,
  };
}

/**
 * The burst's converter input current from a full bank of ideal cells (no ESR, no sag):
 * I_in = V_out·I_burst / (η·V_full). Above the converter's input limit, more cells in
 * parallel cannot help (they lower ESR and sag, not this current).
 */
export function burstLimit({ converter, load, fullVolts }: { converter: ConverterSpec; load: LoadSpec; fullVolts: number }): BurstBlocked | null {
  const eta = efficiencyAt({ efficiency: converter.efficiency, volts: fullVolts });
  const inputAmps = inputCurrentAmps({ outputWatts: converter.outputVolts * load.burstAmps, eta, inputVolts: fullVolts });
  return inputAmps > converter.inputLimitAmps ? { inputAmps, limitAmps: converter.inputLimitAmps, fullVolts } : null;
}

/** The planned bank: the input's cell type, `cellsSeries` in each string, `cellsParallel` strings. */
export function bankSpec(input: Pick<PlanInput, 'cell' | 'cellsSeries'>, cellsParallel: number): BankSpec {
  const { cell } = input;
  return {
    cellsSeries: input.cellsSeries,
    cellsParallel,
    cellFarads: cell.farads,
    cellRatedVolts: cell.ratedVolts,
    cellEsrOhms: cell.esrOhms,
    cellLeakageAmps: cell.leakageAmps,
  };
}

// Margin grows with the cell count (reserve ∝ np, and the floor falls as ESR drops) faster
// than leakage does, so doubling then bisecting finds the smallest passing count.
function smallestPassing({ passes, max }: { passes: (n: number) => boolean; max: number }): number | null {
  let high = 1;
  while (!passes(high)) {
    if (high >= max) return null;
    high = Math.min(max, high * 2);
  }
  let low = Math.floor(high / 2); // fails (or 0)
  while (high - low > 1) {
    const mid = Math.floor((low + high) / 2);
    if (passes(mid)) high = mid;
    else low = mid;
  }
  return high;
}

function curveFromFull({
  bank,
  converter,
  load,
  floorVolts,
  windowSeconds,
  stepSeconds,
}: {
  bank: BankModel;
  converter: ConverterSpec;
  load: LoadSpec;
  floorVolts: number;
  windowSeconds: number;
  stepSeconds: number;
}): { t: number; volts: number }[] {
  const outputWatts = averageOutputWatts({ load, outputVolts: converter.outputVolts });
  const table = buildDischargeTable({
    farads: bank.farads,
    fromVolts: bank.maxVolts,
    downToVolts: Math.min(floorVolts, bank.maxVolts),
    bankWattsAt: bankWattsCurve({ outputWatts, efficiency: converter.efficiency, leakageAmps: bank.leakageAmps }),
    breakVolts: efficiencyBreakVolts({ efficiency: converter.efficiency }),
  });
  return traceDischarge({ table, stepSeconds, untilSeconds: windowSeconds });
}
