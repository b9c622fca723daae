/**
 * DESIGN.md §3 cautions for bench work on cells (common practice for charged capacitors; the
 * maker's datasheet and the lab's own rules come first).
 */
export function BenchCautions() {
  return (
    <aside role="note" aria-label="Caution: bench work on charged cells" className="rounded-lg border-2 border-hazard bg-dusk-950 p-3 text-sm" data-testid="bench-cautions">
      <p className="font-bold text-hazard">Caution at the bench</p>
      <ul className="mt-2 list-disc space-y-1 pl-5 text-ink-muted">
        <li>A charged cell can deliver hundreds of amps into a short: keep the leads apart, use insulated clips, and discharge each cell fully before handling or storing it.</li>
        <li>Charge no cell above its rated voltage, and mind its polarity: a reversed or over-charged cell heats, swells and can vent.</li>
        <li>The constant-current load gets hot at higher currents: rate it for the power (V × I at the start of the discharge) and keep it off the bench top.</li>
        <li>A cell that warms, bulges or smells sweet during a test is done: stop, let it cool apart from others, and dispose of it as the maker says.</li>
      </ul>
    </aside>
  );
}
