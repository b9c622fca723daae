/** The measurement in one line, so a reader can check what the figures mean. */
export function BenchMethod() {
  return (
    <p className="rounded-lg border border-dusk-700 bg-dusk-900 px-4 py-3 text-sm text-ink-muted" data-testid="bench-method">
      <strong className="text-ink">Method (IEC 62391-1, constant-current discharge): </strong>
      <span className="figures">C = I·(t2 − t1)/(V1 − V2)</span> between V1 = 80 % and V2 = 40 % of the rated voltage;{' '}
      <span className="figures">R = ΔV/I</span> from the voltage step at the discharge start (the straight part of the curve extrapolated back).
      A cell is flagged below 80 % of its rated capacitance or above twice its rated ESR.
    </p>
  );
}
