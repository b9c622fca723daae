import { describe, expect, it } from 'vitest';
import { NODE_STATE_INFO, NODE_STATES } from '@/lib/config/node-states';
import { demoNodes } from '@/simulator/fleet/demo-fleet';
import { api } from './helpers/stack';
import { signedIn } from './helpers/session';

// GET /api/v1/fleet and GET /api/v1/fleet/soc-series against the running demo.
const larkspurNames = demoNodes.filter((n) => n.organizationSlug === 'larkspur-hollow').map((n) => n.name);

describe('GET /api/v1/fleet', () => {
  it('lists the 12 demo nodes with their state and figures, most at risk first', async () => {
    const s = await signedIn('viewer@larkspur.example');
    const res = await s.agent.get('/api/v1/fleet');
    expect(res.status).toBe(200);
    const { nodes, counts, earliest_brownout: earliest } = res.body;
    // The demo scenario (DESIGN.md §8): twelve nodes in this organization.
    expect(larkspurNames).toHaveLength(12);
    const names = nodes.map((n: { name: string }) => n.name);
    for (const name of larkspurNames) expect(names).toContain(name);
    for (const n of nodes) {
      expect(NODE_STATES).toContain(n.state);
      for (const key of ['volts', 'soc', 'reserve_joules', 'margin', 'recharge_at', 'brownout_at', 'last_reading_at', 'load_watts', 'measured_watts', 'modelled_watts', 'draw_ratio', 'max_volts', 'time_zone', 'site_name']) {
        expect(n).toHaveProperty(key);
      }
      // One modelled draw for a node everywhere: the ratio is measured over the same night's model.
      expect(n.draw_ratio).toBe(n.measured_watts != null && n.modelled_watts ? n.measured_watts / n.modelled_watts : null);
    }
    // Counts per state add up to the listed nodes.
    expect(Object.values(counts as Record<string, number>).reduce((a, b) => a + b, 0)).toBe(nodes.length);
    // DESIGN.md §8: "every node state shows up" in the demo.
    for (const state of NODE_STATES) expect(counts[state]).toBeGreaterThan(0);
    // Most at risk first: the state's risk rank never falls down the list, then margin ascending.
    for (let i = 1; i < nodes.length; i++) {
      const [a, b] = [nodes[i - 1], nodes[i]];
      const rankA = NODE_STATE_INFO[a.state as keyof typeof NODE_STATE_INFO].riskRank;
      const rankB = NODE_STATE_INFO[b.state as keyof typeof NODE_STATE_INFO].riskRank;
      expect(rankA).toBeLessThanOrEqual(rankB);
      if (rankA === rankB && a.margin != null && b.margin != null) expect(a.margin).toBeLessThanOrEqual(b.margin);
    }
    // The earliest projected brownout is the soonest still ahead among the short nodes (derived here).
    const shortTimes = nodes
      .filter((n: { state: string; brownout_at: string | null }) => n.state === 'short' && n.brownout_at && Date.parse(n.brownout_at) > Date.parse(res.body.generated_at))
      .map((n: { brownout_at: string }) => Date.parse(n.brownout_at));
    expect(earliest ? Date.parse(earliest.at) : null).toBe(shortTimes.length ? Math.min(...shortTimes) : null);
    // Short nodes whose brownout has already passed are listed apart, soonest first; a bank over
    // 98 % of its rating is listed as a hazard (derived here from the rows themselves).
    type Row = { id: number; state: string; brownout_at: string | null; volts: number | null; max_volts: number };
    const overdue = (nodes as Row[])
      .filter((n) => n.state === 'short' && n.brownout_at && Date.parse(n.brownout_at) <= Date.parse(res.body.generated_at))
      .sort((a, b) => Date.parse(a.brownout_at!) - Date.parse(b.brownout_at!));
    expect(res.body.overdue_brownouts.map((o: { node_id: number }) => o.node_id)).toEqual(overdue.map((n) => n.id));
    expect(res.body.over_voltage.map((o: { node_id: number }) => o.node_id).sort()).toEqual(
      (nodes as Row[]).filter((n) => n.volts !== null && n.volts > 0.98 * n.max_volts).map((n) => n.id).sort(),
    );
  });

  it('reports state of charge by energy, not by volts: (V² − Vcut²)/(Vmax² − Vcut²)', async () => {
    const s = await signedIn('viewer@larkspur.example');
    const { nodes } = (await s.agent.get('/api/v1/fleet')).body;
    const withVolts = nodes.filter((n: { volts: number | null }) => n.volts != null);
    expect(withVolts.length).toBeGreaterThan(5);
    for (const n of withVolts) {
      const spec = (await s.agent.get(`/api/v1/nodes/${n.id}`)).body;
      const maxVolts = spec.bank.cells_series * spec.bank.cell_rated_volts;
      const cut = spec.converter.cutoff_volts;
      // DESIGN.md §3 definition, clamped to 0..1 (derived here from the stored volts).
      const expected = Math.min(1, Math.max(0, (n.volts ** 2 - cut ** 2) / (maxVolts ** 2 - cut ** 2)));
      expect(n.soc, `${n.name} ${n.volts} V, spec ${JSON.stringify(spec.bank)} cut ${cut}`).toBeCloseTo(expected, 6);
      // Reserve in J; the wire carries joules, Wh is 1/3600 of it at the edge (SI, common practice).
      if (n.reserve_joules != null) expect(n.reserve_joules).toBeGreaterThanOrEqual(0);
    }
  });

  it('answers 401 signed out, and shows another organization none of these nodes', async () => {
    expect((await api().get('/api/v1/fleet')).status).toBe(401);
    expect((await api().get('/api/v1/fleet/soc-series?hours=48')).status).toBe(401);
    const other = await signedIn('owner@cinderflats.example');
    const names = (await other.agent.get('/api/v1/fleet')).body.nodes.map((n: { name: string }) => n.name);
    for (const name of larkspurNames) expect(names).not.toContain(name);
  });
});

describe('GET /api/v1/fleet/soc-series', () => {
  it('gives one line per node over 48 h in at most 3000 points, SoC within 0..1, nights inside the span', async () => {
    const s = await signedIn('deployer@larkspur.example');
    const res = await s.agent.get('/api/v1/fleet/soc-series?hours=48');
    expect(res.status).toBe(200);
    const { t, soc, nodes, bucket_seconds: bucket, nights, from, to } = res.body;
    expect(nodes.length).toBeGreaterThanOrEqual(10); // the demo's nodes that have readings (one is `new`)
    expect(soc).toHaveLength(nodes.length);
    expect(t.length * nodes.length).toBeLessThanOrEqual(3000);
    expect(bucket % 300).toBe(0); // built from the 5-minute rollups
    // 48 h covered: first bucket at or before `from`, buckets contiguous (derived here).
    expect(t[0]).toBeLessThanOrEqual(Date.parse(from) / 1000);
    expect(t[t.length - 1] + bucket).toBeGreaterThanOrEqual(Date.parse(to) / 1000 - bucket);
    for (let i = 1; i < t.length; i++) expect(t[i] - t[i - 1]).toBe(bucket);
    let values = 0;
    for (const line of soc) {
      expect(line).toHaveLength(t.length);
      for (const v of line) if (v != null) { expect(v).toBeGreaterThanOrEqual(0); expect(v).toBeLessThanOrEqual(1); values++; }
    }
    expect(values).toBeGreaterThan(t.length); // real data, not an empty grid
    // Near 47° N any 48 h holds at least one night; each lasts 6–18 h (common practice: the
    // longest night at 47° N is about 16 h, the shortest about 8 h).
    expect(nights.length).toBeGreaterThanOrEqual(1);
    for (const n of nights) {
      expect(n.to).toBeGreaterThan(n.from);
      expect(n.from).toBeGreaterThanOrEqual(Math.floor(Date.parse(from) / 1000));
      expect(n.to).toBeLessThanOrEqual(Math.ceil(Date.parse(to) / 1000));
    }
    const inner = nights.filter((n: { from: number; to: number }) => n.from > Date.parse(from) / 1000 && n.to < Date.parse(to) / 1000);
    for (const n of inner) expect((n.to - n.from) / 3600).toBeGreaterThan(6);
    for (const n of inner) expect((n.to - n.from) / 3600).toBeLessThan(18);
  });

  it('keeps a week within the same budget and refuses hours outside 1–168', async () => {
    const s = await signedIn('viewer@larkspur.example');
    const week = await s.agent.get('/api/v1/fleet/soc-series?hours=168');
    expect(week.status).toBe(200);
    expect(week.body.t.length * week.body.nodes.length).toBeLessThanOrEqual(3000);
    for (const bad of ['0', '169', '2.5', 'abc']) {
      const res = await s.agent.get(`/api/v1/fleet/soc-series?hours=${bad}`);
      expect(res.status).toBe(422);
      expect(res.body.errors[0].pointer).toBe('/hours');
    }
  });
});
