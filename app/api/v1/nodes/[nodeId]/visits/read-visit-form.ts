import { Readable } from 'node:stream';
import busboy from 'busboy';
import { problems } from '@/lib/errors';
import { MAX_PHOTO_BYTES } from '@/lib/schemas/visit';

/**
 * The visit form's multipart body: small text fields and at most one photo, held in memory
 * (a photo is at most 5 MB; busboy stops reading past the limit). Route-local because the
 * shared lib/http/multipart streams a required file, while here the photo is optional.
 */
export async function readVisitForm(request: Request): Promise<{ fields: Record<string, string>; photo: Buffer | null }> {
  const type = request.headers.get('content-type') ?? '';
  if (!type.toLowerCase().startsWith('multipart/form-data')) throw problems.unsupportedMedia('Send the visit as multipart/form-data.');
  if (!request.body) throw problems.badRequest('The body is empty.');
  let parser: busboy.Busboy;
  try {
    parser = busboy({ headers: { 'content-type': type }, limits: { files: 1, fileSize: MAX_PHOTO_BYTES, fields: 10, fieldSize: 10_000 } });
  } catch {
    throw problems.badRequest('The multipart body is malformed.');
  }
  const fields: Record<string, string> = {};
  let photo: Buffer | null = null;
  let tooLarge = false;
  return new Promise((resolve, reject) => {
    parser.on('field', (name, value) => { fields[name] = value; });
    parser.on('file', (name, stream) => {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('limit', () => { tooLarge = true; });
      stream.on('end', () => {
        // An empty file input still sends a part with no bytes: that is "no photo".
        if (name === 'photo' && !tooLarge) photo = chunks.length ? Buffer.concat(chunks) : null;
      });
    });
    parser.on('error', () => reject(problems.badRequest('The multipart body is malformed.')));
    parser.on('close', () => {
      if (tooLarge) reject(problems.invalid([{ pointer: '/photo', detail: 'The photo is over 5 MB.' }]));
      else resolve({ fields, photo: photo && photo.length ? photo : null });
    });
    Readable.fromWeb(request.body as import('node:stream/web').ReadableStream).on('error', reject).pipe(parser);
  });
}
