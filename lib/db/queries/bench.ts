import { db } from '../knex';
import { batchFlags, type Characterization } from '../../energy';
import type { BenchBatchWire, BenchRunFields, BenchRunWire } from '../../schemas/bench-runs';

/** Bench runs: one characterized cell each, grouped by batch label. */
// The stored columns are the wire's measured fields; the ratios and flags are derived.
type BenchRunRow = Pick<BenchRunWire, 'id' | 'batch_label' | 'cell_label' | 'nominal_farads' | 'nominal_esr_ohms' | 'rated_volts' | 'current_amps' | 'capacitance_farads' | 'esr_ohms' | 't1_seconds' | 't2_seconds'> & {
  created_at: Date;
  uploader: string | null;
};

function runToWire(r: BenchRunRow): BenchRunWire {
  // Each cell against its own nominal rating (lib/energy batchFlags: < 80 % C, > 2× ESR).
  const [flags] = batchFlags({ cells: [{ capacitanceFarads: r.capacitance_farads, esrOhms: r.esr_ohms }], nominal: { farads: r.nominal_farads, esrOhms: r.nominal_esr_ohms } }).cells;
  return {
    id: r.id, batch_label: r.batch_label, cell_label: r.cell_label, nominal_farads: r.nominal_farads, nominal_esr_ohms: r.nominal_esr_ohms,
    rated_volts: r.rated_volts, current_amps: r.current_amps, capacitance_farads: r.capacitance_farads, esr_ohms: r.esr_ohms,
    t1_seconds: r.t1_seconds, t2_seconds: r.t2_seconds, capacitance_ratio: flags.capacitanceRatio, esr_ratio: flags.esrRatio,
    low_capacitance: flags.lowCapacitance, high_esr: flags.highEsr, uploaded_by: r.uploader, created_at: new Date(r.created_at).toISOString(),
  };
}

const runColumns = ['b.id', 'b.batch_label', 'b.cell_label', 'b.nominal_farads', 'b.nominal_esr_ohms', 'b.rated_volts', 'b.current_amps',
  'b.capacitance_farads', 'b.esr_ohms', 'b.t1_seconds', 'b.t2_seconds', 'b.created_at'];

export async function insertBenchRun({ orgId, userId, fields, result }: { orgId: number; userId: number; fields: BenchRunFields; result: Characterization }): Promise<BenchRunWire> {
  const [id] = await db()('bench_runs').insert({
    org_id: orgId, batch_label: fields.batch_label, cell_label: fields.cell_label, nominal_farads: fields.nominal_farads,
    nominal_esr_ohms: fields.nominal_esr_ohms, rated_volts: fields.rated_volts, current_amps: fields.current_amps,
    capacitance_farads: result.capacitanceFarads, esr_ohms: result.esrOhms, t1_seconds: result.t1Seconds, t2_seconds: result.t2Seconds,
    uploaded_by: userId,
  });
  const row = await db()('bench_runs as b').leftJoin('users as u', 'u.id', 'b.uploaded_by').where('b.id', id)
    .first([...runColumns, db().raw("COALESCE(NULLIF(u.name, ''), u.email) as uploader")]);
  return runToWire(row);
}

/** Every batch of the organization, newest first; cells in upload order. */
export async function listBenchBatches(orgId: number): Promise<BenchBatchWire[]> {
  const rows: BenchRunRow[] = await db()('bench_runs as b').leftJoin('users as u', 'u.id', 'b.uploaded_by')
    .where('b.org_id', orgId).orderBy('b.id')
    .select([...runColumns, db().raw("COALESCE(NULLIF(u.name, ''), u.email) as uploader")]);
  const byBatch = new Map<string, BenchRunWire[]>();
  for (const r of rows) {
    const cells = byBatch.get(r.batch_label) ?? [];
    cells.push(runToWire(r));
    byBatch.set(r.batch_label, cells);
  }
  const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
  return [...byBatch.entries()]
    .map(([batch_label, cells]) => ({
      batch_label,
      cells,
      flagged: cells.filter((c) => c.low_capacitance || c.high_esr).length,
      mean_capacitance_ratio: mean(cells.map((c) => c.capacitance_ratio)),
      mean_esr_ratio: mean(cells.map((c) => c.esr_ratio)),
      latest_at: cells[cells.length - 1].created_at,
    }))
    .sort((a, b) => b.latest_at.localeCompare(a.latest_at));
}
