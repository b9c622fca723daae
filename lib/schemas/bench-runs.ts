import { z } from 'zod';
import { benchFields, MAX_SAMPLES } from './bench';
import { finiteNumber, positiveNumber, upTo } from './model';

/**
 * POST /api/v1/bench/runs (deployer or owner): characterize one cell's constant-current
 * discharge log (IEC 62391-1, as POST /api/v1/bench/characterize) and keep it in its batch.
 * JSON {batch_label, cell_label, nominal_farads, nominal_esr_ohms, rated_volts, current_amps,
 * samples: [[seconds, volts], ...]} or multipart/form-data with the same fields and a CSV
 * `file` (header `seconds,volts`). 201 → the stored run (BenchRunWire).
 * GET /api/v1/bench/runs (any member) → {batches: [BenchBatchWire]}, newest batch first.
 */
const label = (what: string) => z.string({ message: `Name the ${what}.` }).trim().min(1, `Name the ${what}.`).max(120, 'At most 120 characters.');

export const benchRunFields = z.object({
  batch_label: label('batch'),
  cell_label: label('cell'),
  nominal_farads: positiveNumber('F').max(100_000, upTo(100_000, 'F')),
  nominal_esr_ohms: positiveNumber('Ω').max(100, upTo(100, 'Ω')),
  ...benchFields,
});

export const benchRunJsonBody = benchRunFields
  .extend({
    samples: z.array(z.tuple([finiteNumber('s'), finiteNumber('V').min(-1000).max(1000)])).min(3, 'A discharge log needs at least 3 samples.').max(MAX_SAMPLES, `At most ${MAX_SAMPLES} samples.`),
  })
  .strict();

export type BenchRunFields = z.infer<typeof benchRunFields>;

export interface BenchRunWire {
  id: number;
  batch_label: string;
  cell_label: string;
  nominal_farads: number;
  nominal_esr_ohms: number;
  rated_volts: number;
  current_amps: number;
  capacitance_farads: number;
  esr_ohms: number;
  t1_seconds: number;
  t2_seconds: number;
  /** measured ÷ nominal */
  capacitance_ratio: number;
  esr_ratio: number;
  /** below 80 % of the rated capacitance */
  low_capacitance: boolean;
  /** above twice the rated ESR */
  high_esr: boolean;
  uploaded_by: string | null;
  created_at: string;
}

export interface BenchBatchWire {
  batch_label: string;
  cells: BenchRunWire[];
  flagged: number;
  mean_capacitance_ratio: number;
  mean_esr_ratio: number;
  latest_at: string;
}
