import { Readable } from 'node:stream';
import busboy from 'busboy';
import { problems } from '../errors';

/**
 * Streams the first file of a multipart/form-data request to `onFile`, without buffering the
 * upload; plain fields are collected (small) and passed along.
 */
export async function withUploadedFile<T>(
  request: Request,
  opts: { maxBytes: number },
  onFile: (file: { filename: string; stream: Readable; fields: Record<string, string> }) => Promise<T>,
): Promise<T> {
  const type = request.headers.get('content-type') ?? '';
  if (!type.toLowerCase().startsWith('multipart/form-data')) throw problems.unsupportedMedia('Upload the file as multipart/form-data.');
  if (!request.body) throw problems.badRequest('The upload is empty.');
  let parser: busboy.Busboy;
  try {
    parser = busboy({ headers: { 'content-type': type }, limits: { files: 1, fileSize: opts.maxBytes, fields: 20, fieldSize: 10_000 } });
  } catch {
    throw problems.badRequest('The multipart body is malformed.');
  }
  const fields: Record<string, string> = {};
  return new Promise<T>((resolve, reject) => {
    let sawFile = false;
    parser.on('field', (name, value) => { fields[name] = value; });
    parser.on('file', (_name, stream, info) => {
      sawFile = true;
      stream.on('limit', () => reject(problems.tooLarge(`The file is over ${Math.round(opts.maxBytes / 1_048_576)} MB.`)));
      onFile({ filename: info.filename || 'upload.csv', stream, fields }).then(resolve, reject);
    });
    parser.on('error', () => reject(problems.badRequest('The multipart body is malformed.')));
    parser.on('close', () => { if (!sawFile) reject(problems.invalid([{ pointer: '/file', detail: 'Attach a CSV file.' }])); });
    Readable.fromWeb(request.body as import('node:stream/web').ReadableStream).on('error', reject).pipe(parser);
  });
}
