/**
 * What an import came to, in the words the screens show. Pure, so the report component and
 * the server say the same thing. The stored status stays one of the `imports.status` enum
 * (running, done, failed); "nothing imported" and "nothing new" are display words over it.
 */
export interface ImportOutcomeInput {
  status: 'running' | 'done' | 'failed';
  lines: number;
  accepted: number;
  duplicates: number;
  rejected: number;
  rejections: { line: number; reason: string }[];
}

export type ImportWord = 'running' | 'done' | 'nothing new' | 'nothing imported' | 'failed';

/** No line of the file is in the database, neither new nor already there. */
export function nothingStored(r: Pick<ImportOutcomeInput, 'accepted' | 'duplicates'>): boolean {
  return r.accepted === 0 && r.duplicates === 0;
}

/**
 * The status to keep: an import that stored nothing failed, whatever the reason. Rows kept
 * before this rule said "done" for a file of only refused lines; reading them through this
 * keeps the history honest without a migration.
 */
export function importStatus(r: ImportOutcomeInput): ImportOutcomeInput['status'] {
  if (r.status === 'done' && nothingStored(r)) return 'failed';
  return r.status;
}

export function importWord(r: ImportOutcomeInput): ImportWord {
  const status = importStatus(r);
  if (status === 'running') return 'running';
  if (status === 'failed') return nothingStored(r) ? 'nothing imported' : 'failed';
  return r.accepted === 0 ? 'nothing new' : 'done';
}

/** One sentence saying why, for a failed import or one that stored nothing new; null otherwise. */
export function importReason(r: ImportOutcomeInput): string | null {
  const word = importWord(r);
  if (word === 'nothing new') return `Every good line was already stored (${r.duplicates} duplicate${r.duplicates === 1 ? '' : 's'}).`;
  if (word !== 'nothing imported' && word !== 'failed') return null;
  // A file-level reason (line 0: header, empty file, storage) says it best.
  const fileLevel = r.rejections.find((x) => x.line === 0);
  if (fileLevel) return fileLevel.reason;
  const first = r.rejections[0];
  if (r.lines === 0) return first?.reason ?? 'The file has a header line but no readings.';
  if (word === 'nothing imported' && first) {
    return `None of the ${r.lines} line${r.lines === 1 ? '' : 's'} could be stored. Line ${first.line}: ${first.reason}`;
  }
  return first?.reason ?? 'The file could not be imported.';
}
