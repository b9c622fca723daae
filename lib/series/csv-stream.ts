import { csvLine } from './csv';

/**
 * Rows from the database → a web ReadableStream of CSV, pulled as the client reads: one batch
 * of lines per pull, so memory holds a batch, never the file. Cancelling (the client went away)
 * stops the database stream and frees its connection.
 */
const LINES_PER_CHUNK = 500;

export function csvReadableStream<Row>({
  header,
  rows,
  toLine,
  onError,
}: {
  header: string[];
  rows: AsyncIterable<Row> & { destroy?: (error?: Error) => void };
  toLine: (row: Row) => string;
  onError?: (error: unknown) => void;
}): ReadableStream<Uint8Array> {
  const encoder = new TextEncoder();
  const iterator = rows[Symbol.asyncIterator]();
  let headerSent = false;
  return new ReadableStream<Uint8Array>({
    async pull(controller) {
      if (!headerSent) {
        headerSent = true;
        controller.enqueue(encoder.encode(csvLine(header)));
        return;
      }
      let chunk = '';
      try {
        for (let i = 0; i < LINES_PER_CHUNK; i++) {
          const next = await iterator.next();
          if (next.done) {
            if (chunk) controller.enqueue(encoder.encode(chunk));
            controller.close();
            return;
          }
          chunk += toLine(next.value);
        }
      } catch (error) {
        // Headers are gone already: the only honest signal left is a cut-off download.
        onError?.(error);
        controller.error(error);
        return;
      }
      controller.enqueue(encoder.encode(chunk));
    },
    async cancel() {
      rows.destroy?.();
      await iterator.return?.();
    },
  });
}

/** A download name from a node's name and the range (letters, digits, dot, dash, underscore). */
export function downloadName({ nodeName, suffix }: { nodeName: string; suffix: string }): string {
  const safe = nodeName.replace(/[^A-Za-z0-9._-]+/g, '_').slice(0, 80) || 'node';
  return `${safe}-${suffix}.csv`;
}
