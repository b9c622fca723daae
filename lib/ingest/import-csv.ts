import { createInterface } from 'node:readline';
import type { Readable } from 'node:stream';
import { storeReadings } from '../db/queries/readings';
import { rebuildRollups } from '../db/queries/rollups';
import { refreshNodeStatus } from '../db/queries/status';
import { db } from '../db/knex';
import { csvLineToObject, parseCsvHeader, separatorHint } from './csv';
import { bankVoltsProblem, type ImportBank } from './import-bank-check';
import { importReason, importStatus } from './import-outcome';
import { normalizeReading, type NormalizedReading } from './normalize';

/**
 * A CSV log uploaded for a node, read line by line from the stream (never whole in memory)
 * and stored in batches. Unlike a device post, an import keeps its good lines and reports
 * the bad ones with reasons; the report is kept in `imports`. Unlike a device post, it also
 * refuses bank volts that cannot be this node's bank (`import-bank-check.ts`). An import that
 * stores nothing is `failed`, with its reason.
 */
const BATCH = 500; // one multi-row INSERT a batch when the lines are new
const MAX_REPORTED = 200;

export interface ImportReport {
  id: number;
  lines: number;
  accepted: number;
  duplicates: number;
  rejected: number;
  rejections: { line: number; reason: string }[];
  status: 'done' | 'failed';
  /** Why it failed or stored nothing new, in one sentence; null for a plain success. */
  reason: string | null;
}

export async function importCsvStream(opts: { orgId: number; nodeId: number; userId: number; filename: string; stream: Readable; bank: ImportBank }): Promise<ImportReport> {
  const [id] = await db()('imports').insert({ org_id: opts.orgId, node_id: opts.nodeId, uploaded_by: opts.userId, filename: opts.filename.slice(0, 255) });
  const report: ImportReport = { id, lines: 0, accepted: 0, duplicates: 0, rejected: 0, rejections: [], status: 'done', reason: null };
  const reject = (line: number, reason: string) => {
    report.rejected++;
    if (report.rejections.length < MAX_REPORTED) report.rejections.push({ line, reason });
  };
  const receivedAt = new Date();
  let fields: string[] | null = null;
  let batch: NormalizedReading[] = [];
  let minT = Infinity;
  let maxT = -Infinity;
  const flush = async () => {
    if (!batch.length) return;
    const r = await storeReadings(opts.nodeId, batch);
    report.accepted += r.accepted;
    report.duplicates += r.duplicates;
    for (const s of r.stored) {
      minT = Math.min(minT, s.t.getTime());
      maxT = Math.max(maxT, s.t.getTime());
    }
    batch = [];
  };
  try {
    const lines = createInterface({ input: opts.stream, crlfDelay: Infinity });
    let lineNo = 0;
    for await (const line of lines as AsyncIterable<string>) {
      lineNo++;
      if (line.trim() === '') continue;
      if (!fields) {
        const header = parseCsvHeader(line);
        if ('error' in header) {
          reject(lineNo, separatorHint(line) ?? header.error);
          report.status = 'failed';
          break;
        }
        fields = header.fields;
        continue;
      }
      report.lines++;
      if (line.includes('\uFFFD')) {
        reject(lineNo, 'Not UTF-8 text.');
        continue;
      }
      const hint = separatorHint(line);
      const obj = csvLineToObject(fields, line);
      if ('error' in obj) {
        reject(lineNo, hint ? `${obj.error} ${hint}` : String(obj.error));
        continue;
      }
      const { reading, problems } = normalizeReading(obj, '', receivedAt);
      const bankProblem = reading ? bankVoltsProblem({ bank: opts.bank, reportedVolts: reading.v }) : null;
      if (!reading) reject(lineNo, [problems.map(namedProblem).join('; '), hint].filter(Boolean).join(' '));
      else if (bankProblem) reject(lineNo, bankProblem);
      else batch.push(reading);
      if (batch.length >= BATCH) await flush();
    }
    if (!fields && report.status === 'done') {
      reject(0, 'The file is empty: it needs a header line naming the columns.');
      report.status = 'failed';
    } else if (fields && report.lines === 0) {
      reject(0, 'The file has a header line but no readings.');
      report.status = 'failed';
    }
    await flush();
  } catch (e) {
    console.error('[import] failed', e);
    report.status = 'failed';
    reject(0, 'Storage failed part-way; the lines counted as accepted are stored. Upload the file again to finish: stored lines count as duplicates.');
  }
  if (importStatus(report) === 'failed') report.status = 'failed';
  report.reason = importReason(report);
  if (Number.isFinite(minT)) {
    await rebuildRollups(db(), opts.nodeId, new Date(minT), new Date(maxT)).catch((e) => console.error('[import] rollups', e));
    await refreshNodeStatus(opts.nodeId).catch((e) => console.error('[import] status', e));
  }
  await db()('imports').where({ id }).update({
    status: report.status, lines: report.lines, accepted: report.accepted, duplicates: report.duplicates, rejected: report.rejected,
    report: JSON.stringify(report.rejections), finished_at: new Date(),
  });
  return report;
}

export async function listImports(orgId: number, nodeId: number) {
  const rows = await db()('imports as i').leftJoin('users as u', 'u.id', 'i.uploaded_by').where({ 'i.org_id': orgId, 'i.node_id': nodeId }).orderBy('i.id', 'desc').limit(50)
    .select('i.id', 'i.filename', 'i.status', 'i.lines', 'i.accepted', 'i.duplicates', 'i.rejected', 'i.report', 'i.created_at as createdAt', 'i.finished_at as finishedAt', 'u.email as uploadedBy');
  return rows.map((r) => {
    const kept = { ...r, rejections: typeof r.report === 'string' ? JSON.parse(r.report) : r.report ?? [], report: undefined };
    return { ...kept, status: importStatus(kept), reason: importReason(kept) };
  });
}

/** "t: Not a real date and time."; a detail that already starts with its field's name stays as it is. */
function namedProblem(p: { pointer: string; detail: string }): string {
  const field = p.pointer.replace(/^\//, '') || 'line';
  return p.detail.startsWith(`${field} `) ? p.detail : `${field}: ${p.detail}`;
}
