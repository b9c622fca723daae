import type { SimBank, SimCharger, SimConverter, SimLoad, SimPanel } from '../physics/types';
import { BOOST_3V3, CELL_100F, CELL_10F, CELL_25F, CELL_50F, CHARGER, makeBank, makeLoad, makePanel } from './demo-parts';

// The twelve demo nodes of the watershed trust, and two for the second organization.
// `config` is what the owner entered (it goes into the database); `hidden` is the physical
// truth only the simulator knows (the faults the product must reveal from the readings).

export type DemoNodeState = 'steady' | 'thin' | 'short' | 'dark' | 'silent' | 'new';

export interface DemoHiddenFaults {
  capacitanceFactor?: number;
  leakageFactor?: number;
  shadingFactor?: number;
  dirtFactor?: number;
  stuckAwakeAmps?: number;
  /** Fault onsets, in hours before the demo's "now". */
  panelLostHoursBeforeNow?: number;
  stuckAwakeHoursBeforeNow?: number;
  linkFaultHoursBeforeNow?: number;
  /** No reading ever arrives (a node configured but not yet on the air). */
  neverReported?: boolean;
}

export interface DemoNode {
  slug: string;
  name: string;
  organizationSlug: string;
  siteSlug: string;
  kind: 'stream-level' | 'soil-moisture' | 'groundwater-level' | 'weather';
  intendedState: DemoNodeState;
  /** Why it is in that state (for the README and for people reading the demo). */
  story: string;
  config: {
    bank: SimBank;
    converter: SimConverter;
    load: SimLoad;
    panel: SimPanel;
    charger: SimCharger;
    calibration: { gain: number; offsetVolts: number };
  };
  hidden: DemoHiddenFaults;
  rssiDbm: number;
  /**
   * The demo's story must hold whatever hour it is seeded, but a night margin changes with the
   * hours left to sunrise. A node marked here gets its configured report interval chosen at
   * seed time (the deployer's cadence) so its margin at "now" sits inside this state's band.
   */
  cadenceFor?: 'thin' | 'short';
}

const LARKSPUR = 'larkspur-hollow';

function node(n: Omit<DemoNode, 'organizationSlug' | 'config'> & { organizationSlug?: string; config: Partial<DemoNode['config']> & { bank: SimBank } }): DemoNode {
  return {
    ...n,
    organizationSlug: n.organizationSlug ?? LARKSPUR,
    config: {
      converter: BOOST_3V3, load: makeLoad(), panel: makePanel(2), charger: CHARGER,
      calibration: { gain: 1, offsetVolts: 0 }, ...n.config,
    },
  };
}

export const demoNodes: DemoNode[] = [
  node({ slug: 'nf-stage-1', name: 'NF-stage-1', siteSlug: 'north-fork-weir', kind: 'stream-level', intendedState: 'steady',
    story: 'Healthy: four 100 F cells, clean panel.', rssiDbm: -61, hidden: {},
    config: { bank: makeBank({ cell: CELL_100F, parallel: 2 }), calibration: { gain: 1.004, offsetVolts: -0.003 } } }),
  node({ slug: 'nf-soil-1', name: 'NF-soil-1', siteSlug: 'north-fork-weir', kind: 'soil-moisture', intendedState: 'thin',
    story: 'Ageing cells: the bank has lost over half its capacitance; it falls faster than modelled.', rssiDbm: -68,
    hidden: { capacitanceFactor: 0.32 },
    config: { bank: makeBank({ cell: CELL_50F }), load: makeLoad({ intervalSeconds: 480 }) } }),
  node({ slug: 'nf-soil-2', name: 'NF-soil-2', siteSlug: 'north-fork-weir', kind: 'soil-moisture', intendedState: 'steady',
    story: 'Healthy, slow cadence.', rssiDbm: -72, hidden: {},
    config: { bank: makeBank({ cell: CELL_50F }), load: makeLoad({ intervalSeconds: 900 }) } }),
  node({ slug: 'mp-stage-1', name: 'MP-stage-1', siteSlug: 'mill-pond-outlet', kind: 'stream-level', intendedState: 'steady',
    story: 'Healthy: two 100 F cells.', rssiDbm: -64, hidden: {},
    config: { bank: makeBank({ cell: CELL_100F }), calibration: { gain: 0.997, offsetVolts: 0.002 } } }),
  node({ slug: 'mp-soil-1', name: 'MP-soil-1', siteSlug: 'mill-pond-outlet', kind: 'soil-moisture', intendedState: 'thin',
    story: 'Leaky cells: self-discharge about a hundred and twenty times the datasheet value.', rssiDbm: -70,
    hidden: { leakageFactor: 120 },
    config: { bank: makeBank({ cell: CELL_50F }) } }),
  node({ slug: 'mp-stage-2', name: 'MP-stage-2', siteSlug: 'mill-pond-outlet', kind: 'stream-level', intendedState: 'thin',
    story: 'Panel under conifers and caked with dirt: the bank never fills in December.', rssiDbm: -75,
    hidden: { shadingFactor: 0.22, dirtFactor: 0.4 }, cadenceFor: 'thin',
    config: { bank: makeBank({ cell: CELL_50F }) } }),
  node({ slug: 'um-piezo-1', name: 'UM-piezo-1', siteSlug: 'upper-meadow-piezometer', kind: 'groundwater-level', intendedState: 'short',
    story: 'Firmware stuck awake since midday (a sensor time-out loop): the bank is sinking fast.', rssiDbm: -66,
    hidden: { stuckAwakeHoursBeforeNow: 10, stuckAwakeAmps: 0.003 },
    config: { bank: makeBank({ cell: CELL_50F }) } }),
  node({ slug: 'um-soil-1', name: 'UM-soil-1', siteSlug: 'upper-meadow-piezometer', kind: 'soil-moisture', intendedState: 'dark',
    story: 'Snow slid over the panel two days ago; the bank ran down and browned out in the small hours.', rssiDbm: -71,
    hidden: { panelLostHoursBeforeNow: 58 },
    config: { bank: makeBank({ cell: CELL_50F }) } }),
  node({ slug: 'um-piezo-2', name: 'UM-piezo-2', siteSlug: 'upper-meadow-piezometer', kind: 'groundwater-level', intendedState: 'new',
    story: 'Just configured; no reading has arrived yet.', rssiDbm: -69, hidden: { neverReported: true },
    config: { bank: makeBank({ cell: CELL_100F }) } }),
  node({ slug: 'qr-culvert-1', name: 'QR-culvert-1', siteSlug: 'quarry-road-culvert', kind: 'stream-level', intendedState: 'short',
    story: 'Undersized bank at a fast cadence: browns out most December nights.', rssiDbm: -63, hidden: {}, cadenceFor: 'short',
    config: { bank: makeBank({ cell: CELL_25F }), load: makeLoad({ intervalSeconds: 360 }) } }),
  node({ slug: 'qr-culvert-2', name: 'QR-culvert-2', siteSlug: 'quarry-road-culvert', kind: 'stream-level', intendedState: 'thin',
    story: 'Small but healthy bank: makes the night with little to spare.', rssiDbm: -67, hidden: {}, cadenceFor: 'thin',
    config: { bank: makeBank({ cell: CELL_25F }), load: makeLoad({ intervalSeconds: 600 }) } }),
  node({ slug: 'qr-soil-1', name: 'QR-soil-1', siteSlug: 'quarry-road-culvert', kind: 'soil-moisture', intendedState: 'silent',
    story: 'Healthy bank, but its antenna cable was knocked loose yesterday: it runs and sends, nothing arrives.', rssiDbm: -80,
    hidden: { linkFaultHoursBeforeNow: 20 },
    config: { bank: makeBank({ cell: CELL_100F }) } }),
];

export const secondDemoNodes: DemoNode[] = [
  node({ slug: 'cf-met-1', name: 'CF-met-1', organizationSlug: 'cinder-flats', siteSlug: 'cinder-flats-mesa', kind: 'weather',
    intendedState: 'steady', story: 'Healthy.', rssiDbm: -58, hidden: {},
    config: { bank: makeBank({ cell: CELL_100F }) } }),
  node({ slug: 'cf-met-2', name: 'CF-met-2', organizationSlug: 'cinder-flats', siteSlug: 'cinder-flats-mesa', kind: 'weather',
    intendedState: 'steady', story: 'Healthy.', rssiDbm: -62, hidden: {},
    config: { bank: makeBank({ cell: CELL_50F }), load: makeLoad({ intervalSeconds: 900 }) } }),
];
