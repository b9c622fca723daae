import type { Knex } from 'knex';
import { drawScaleFrom, modelBank } from '../energy';
import type { PassNode } from '../db/queries/alerts';
import { latestReadingAt, lockUnresolvedAlert, insertAlert, updateAlert, upsertNodeStatus } from '../db/queries/alerts';
import { deriveNodeStatus } from '../status/derive-status';
import { calibratedVolts, modelSpecFromRows } from '../status/node-spec';
import { assessLatestDay, missedDay } from './day-charge';
import { stepAlert } from './hysteresis';
import { ALERT_KINDS, type AlertKind } from './kinds';
import { measureLatestNight } from './night-draw';
import { recentSamplesOf } from './night-draw-of';
import { enqueueAlertMails, type OrgAudience } from './notify';
import { alertDetail, evaluateAlertRules, type AlertDetail, type Verdicts } from './rules';

/**
 * One node in one margin pass: status from the latest reading, then every alert kind stepped,
 * all in one transaction (node_status, alerts and their outbox rows commit together). Two
 * passes racing on the same node meet at alerts.open_key: the loser's transaction fails with a
 * duplicate key or a deadlock, rolls back whole, and is retried against the winner's rows.
 */
export interface NodePassResult {
  nodeId: number;
  state: string;
  opened: AlertKind[];
  resolved: AlertKind[];
  reminded: AlertKind[];
  mails: number;
}

const RACE_ERRORS = new Set(['ER_DUP_ENTRY', 'ER_LOCK_DEADLOCK', 'ER_LOCK_WAIT_TIMEOUT']);
const MAX_ATTEMPTS = 3;

export async function evaluatePassNode({ knex, passNode, now }: { knex: Knex; passNode: PassNode; now: Date }) {
  const { node, site, org } = passNode;
  const spec = modelSpecFromRows(node, site);
  const latest = await latestReadingAt(knex, node.id, now);
  const samples = await recentSamplesOf({ knex, node, now });
  const night = measureLatestNight({ spec, samples, now });
  const status = deriveNodeStatus({
    spec, now, thresholds: { steady: org.steady, thin: org.thin }, lastAdvisedIntervalSeconds: passNode.lastAdvisedIntervalSeconds,
    latest: latest ? { t: latest.t, volts: calibratedVolts(node, latest.v), panelVolts: latest.vp } : null,
    // A node that drew far more than modelled last night is projected with what it drew.
    drawScale: drawScaleFrom({ measuredWatts: night?.measuredWatts, modelledWatts: night?.modelledWatts }),
  });
  const day = assessLatestDay({ spec, samples, now });
  const missed = missedDay({ site: spec.site, lastReadingAt: latest ? new Date(latest.t) : null, now });
  const ruleInput = {
    status, thresholds: { steady: org.steady, thin: org.thin }, alertOnThin: org.alertOnThin, maxVolts: modelBank({ bank: spec.bank }).maxVolts, night, day, missedDay: missed,
  };
  const measuredWatts = night?.measuredWatts ?? null;
  const modelledWatts = night?.modelledWatts ?? null;
  return { status, measuredWatts, modelledWatts, verdicts: evaluateAlertRules(ruleInput), detail: alertDetail({ ...ruleInput, measuredWatts }) };
}

export async function applyNodePass(opts: {
  knex: Knex;
  passNode: PassNode;
  now: Date;
  appUrl: string;
  audienceOf: (orgId: number) => Promise<OrgAudience>;
}): Promise<NodePassResult> {
  const evaluation = await evaluatePassNode(opts);
  const audience = await opts.audienceOf(opts.passNode.org.id);
  for (let attempt = 1; ; attempt++) {
    try {
      return await opts.knex.transaction((trx) => writeNodePass({ ...opts, trx, audience, ...evaluation }));
    } catch (error) {
      if (!RACE_ERRORS.has((error as { code?: string }).code ?? '') || attempt >= MAX_ATTEMPTS) throw error;
    }
  }
}

async function writeNodePass(opts: {
  trx: Knex.Transaction;
  passNode: PassNode;
  now: Date;
  appUrl: string;
  audience: OrgAudience;
  status: ReturnType<typeof deriveNodeStatus>;
  measuredWatts: number | null;
  modelledWatts: number | null;
  verdicts: Verdicts;
  detail: AlertDetail;
}): Promise<NodePassResult> {
  const { trx, passNode, now, detail } = opts;
  const { node, site, org } = passNode;
  await upsertNodeStatus(trx, { nodeId: node.id, orgId: org.id, status: opts.status, measuredWatts: opts.measuredWatts, modelledWatts: opts.modelledWatts });
  const result: NodePassResult = { nodeId: node.id, state: opts.status.state, opened: [], resolved: [], reminded: [], mails: 0 };
  for (const kind of ALERT_KINDS) {
    const existing = await lockUnresolvedAlert(trx, node.id, kind);
    const step = stepAlert({ existing, verdict: opts.verdicts[kind], now, resendShortHours: org.resendShortHours });
    const mailFor = (alertId: number, reminder: boolean) =>
      enqueueAlertMails(trx, {
        orgId: org.id, alertId, siteId: site.id, audience: opts.audience, now,
        mail: { kind, detail, nodeId: node.id, nodeName: node.name, siteName: site.name, timeZone: site.time_zone, cutoffVolts: node.cutoff_volts, appUrl: opts.appUrl, reminder },
      });
    if (step.action === 'open') {
      const id = await insertAlert(trx, { orgId: org.id, nodeId: node.id, kind, detail, now });
      result.opened.push(kind);
      result.mails += await mailFor(id, false);
    } else if (existing && step.action === 'refresh') {
      await updateAlert(trx, existing.id, { detail, clearPasses: 0, now, ...(step.remind ? { notifiedAt: now } : {}) });
      if (step.remind) {
        result.reminded.push(kind);
        result.mails += await mailFor(existing.id, true);
      }
    } else if (existing && step.action === 'count_clear') {
      await updateAlert(trx, existing.id, { clearPasses: step.clearPasses, now });
    } else if (existing && step.action === 'resolve') {
      await updateAlert(trx, existing.id, { clearPasses: existing.clearPasses + 1, resolvedAt: now, now });
      result.resolved.push(kind);
    } else if (existing && step.action === 'hold' && existing.clearPasses > 0) {
      await updateAlert(trx, existing.id, { clearPasses: 0, now });
    }
  }
  return result;
}
