import { formatAmps } from '@/lib/format/units';
import type { NodeBody } from '@/lib/schemas/node';
import { BankCaution } from './bank-caution';
import { computeBankFigures, computeLoadFigures } from './compute-node';
import { BankFiguresPanel, LoadFiguresPanel } from './computed-values';
import { BANK_INPUTS, CONVERTER_INPUTS, fromSi, LOAD_INPUTS, OTHER_INPUTS, type NumberInput } from './node-fields';

/** What a viewer sees instead of the form: the same values and figures, nothing to change. */
export function NodeReadonly({ node, siteName }: { node: NodeBody; siteName: string }) {
  const read = (path: string) => path.split('.').reduce<unknown>((o, k) => (o as Record<string, unknown> | null)?.[k], node);
  const eff = node.converter.efficiency;
  const list = (inputs: NumberInput[]) => inputs.map((i) => (
    <Row key={i.path} label={i.label} figures value={read(i.path) == null ? '—' : withReadable(fromSi(Number(read(i.path)), i.scale), i.unit)} />
  ));
  const bank = computeBankFigures(node.bank);
  return (
    <div className="flex flex-col gap-6" data-testid="node-readonly">
      <p className="text-sm text-ink-muted">Your role can read these settings; deployers and owners change them.</p>
      <Block title="Node"><Row label="Name" value={node.name} /><Row label="Site" value={siteName} /><Row label="Purpose" value={node.purpose || '—'} /></Block>
      <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_20rem] lg:items-start">
        <Block title="Bank">{list(BANK_INPUTS)}</Block>
        <div className="flex flex-col gap-3"><BankFiguresPanel figures={bank} heading="Computed" /><BankCaution shortCircuitAmps={bank?.shortCircuitAmps ?? null} /></div>
      </div>
      <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_20rem] lg:items-start">
        <Block title="Converter and load">
          {list(CONVERTER_INPUTS)}
          <Row label="Efficiency" figures value={typeof eff === 'number' ? `${fromSi(eff, 0.01)} %` : eff.map(([v, e]) => `${v} V → ${fromSi(e, 0.01)} %`).join(', ')} />
          {list(LOAD_INPUTS)}
        </Block>
        <LoadFiguresPanel figures={computeLoadFigures(node)} heading="Computed" />
      </div>
      <Block title="Calibration and panel">{list(OTHER_INPUTS)}</Block>
    </div>
  );
}

function Block({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <section className="rounded-xl border border-dusk-700 bg-dusk-900 p-4">
      <h2 className="text-lg font-bold">{title}</h2>
      <dl className="mt-2">{children}</dl>
    </section>
  );
}

// A current still typed in amps reads better in µA or mA beside them.
function withReadable(value: number, unit: string): string {
  if (unit === 'A' && value > 0 && value < 1) return `${value} A (${formatAmps(value)})`;
  // Counted units (cells, strings) are plural words: "1 string", "2 strings".
  if (value === 1 && (unit === 'cells' || unit === 'strings')) return `1 ${unit.slice(0, -1)}`;
  return `${value} ${unit}`;
}

function Row({ label, value, figures = false }: { label: string; value: string; figures?: boolean }) {
  return (
    <div className="flex justify-between gap-4 border-t border-dusk-800 py-1.5 text-sm first:border-t-0">
      <dt className="shrink-0 text-ink-muted">{label}</dt>
      <dd className={`min-w-0 break-words text-right ${figures ? 'figures' : ''}`}>{value}</dd>
    </div>
  );
}
