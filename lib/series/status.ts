import { measureLatestNight } from '../alerts/night-draw';
import { dischargeWindow, drawScaleFrom, type StateThresholds, type VoltageSample } from '../energy';
import { deriveNodeStatus } from '../status/derive-status';
import type { NodeModelSpec } from '../status/node-spec';
import { bankFigures } from './bank-figures';
import { projectDischarge } from './projection';
import type { StatusReply } from './wire';

/**
 * A node's status as of now, computed from its latest reading (the same derivation the ingest
 * and the margin pass store), plus the draw measured over the latest night and the projection.
 * Computed on each poll rather than read back from node_status, so "dark" and "silent" appear
 * as soon as a node has been quiet long enough, between margin passes.
 */
export function buildStatusReply({
  node,
  spec,
  thresholds,
  advisedSeconds,
  latest,
  samples,
  now,
}: {
  node: StatusReply['node'];
  spec: NodeModelSpec;
  thresholds: StateThresholds;
  advisedSeconds: number | null;
  latest: { t: Date; volts: number; panelVolts: number | null } | null;
  samples: VoltageSample[];
  now: Date;
}): StatusReply {
  const night = latest ? measureLatestNight({ spec, samples, now }) : null;
  // The same projection the margin pass stores: with the measured draw when it is far above the model.
  const drawScale = drawScaleFrom({ measuredWatts: night?.measuredWatts, modelledWatts: night?.modelledWatts });
  const s = deriveNodeStatus({ spec, latest, now, thresholds, lastAdvisedIntervalSeconds: advisedSeconds, drawScale });
  const sec = (d: Date | null) => (d ? d.getTime() / 1000 : null);
  const window = latest ? dischargeWindow({ site: spec.site, at: latest.t }) : null;
  return {
    time_unit: 's',
    node,
    state: s.state,
    last_reading_at: sec(s.last_reading_at),
    volts: s.volts,
    panel_volts: s.panel_volts,
    energy_joules: s.energy_joules,
    soc: s.soc,
    reserve_joules: s.reserve_joules,
    margin: s.margin,
    load_watts: s.load_watts,
    recharge_at: sec(s.recharge_at),
    brownout_at: sec(s.brownout_at),
    charging: window?.chargingNow ?? false,
    charging_until: window?.chargingNow ? sec(window.startAt) : null,
    next_report_s: s.next_report_s,
    evaluated_at: now.getTime() / 1000,
    bank: bankFigures({ spec }),
    measured: night
      ? {
          watts: night.measuredWatts,
          modelled_watts: night.modelledWatts,
          ratio: Number.isFinite(night.ratio) ? night.ratio : null,
          night_start_at: night.startAt.getTime() / 1000,
          night_end_at: night.endAt.getTime() / 1000,
        }
      : null,
    draw_scale: drawScale,
    projection: latest ? projectDischarge({ spec, volts: latest.volts, at: latest.t, drawScale }) : null,
  };
}
