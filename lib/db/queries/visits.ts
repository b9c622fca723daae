import { randomBytes } from 'node:crypto';
import { mkdir, readFile, unlink, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { db } from '../knex';
import { getEnv } from '../../env';
import { problems } from '../../errors';
import { sniffImageType, type VisitFields, type VisitWire } from '../../schemas/visit';
import { getNodeInOrg } from './nodes';

/**
 * Field visits of a node, with an optional photo kept under UPLOAD_DIR/visits by a random
 * name (never the uploader's), served only through the authorized photo route.
 */
const PHOTO_FOLDER = 'visits';

function photoRoot(): string {
  return path.resolve(getEnv().UPLOAD_DIR, PHOTO_FOLDER);
}

export async function listVisits(orgId: number, nodeId: number): Promise<VisitWire[]> {
  await getNodeInOrg(orgId, nodeId);
  const rows = await db()('field_visits as v').leftJoin('users as u', 'u.id', 'v.user_id')
    .where({ 'v.org_id': orgId, 'v.node_id': nodeId }).orderBy([{ column: 'v.visited_on', order: 'desc' }, { column: 'v.id', order: 'desc' }]).limit(200)
    .select('v.id', db().raw("DATE_FORMAT(v.visited_on, '%Y-%m-%d') AS visited_on"), 'v.work_done', 'v.photo_path', 'v.created_at', 'u.name as user_name', 'u.email as user_email');
  return rows.map((r) => ({
    id: r.id, visited_on: r.visited_on, work_done: r.work_done, by: r.user_name || r.user_email || null,
    has_photo: Boolean(r.photo_path), created_at: new Date(r.created_at).toISOString(),
  }));
}

/** Stores the photo first (a failed insert removes it again), then the visit. */
export async function createVisit(opts: { orgId: number; nodeId: number; userId: number; fields: VisitFields; photo: Buffer | null }): Promise<number> {
  await getNodeInOrg(opts.orgId, opts.nodeId);
  let photoName: string | null = null;
  if (opts.photo) {
    const type = sniffImageType(opts.photo.subarray(0, 16));
    if (!type) throw problems.invalid([{ pointer: '/photo', detail: 'The photo must be a JPEG or PNG image.' }]);
    photoName = `${randomBytes(16).toString('hex')}${type === 'image/png' ? '.png' : '.jpg'}`;
    await mkdir(photoRoot(), { recursive: true });
    await writeFile(path.join(photoRoot(), photoName), opts.photo, { flag: 'wx', mode: 0o600 });
  }
  try {
    const [id] = await db()('field_visits').insert({
      org_id: opts.orgId, node_id: opts.nodeId, user_id: opts.userId, visited_on: opts.fields.visited_on, work_done: opts.fields.work_done, photo_path: photoName,
    });
    return id as number;
  } catch (e) {
    if (photoName) await unlink(path.join(photoRoot(), photoName)).catch(() => undefined);
    throw e;
  }
}

export async function getVisitWire(orgId: number, nodeId: number, visitId: number): Promise<VisitWire> {
  const found = (await listVisits(orgId, nodeId)).find((v) => v.id === visitId);
  if (!found) throw problems.notFound('The visit');
  return found;
}

/** The photo's bytes and type; another organization's visit, or one without a photo, is 404. */
export async function readVisitPhoto(orgId: number, nodeId: number, visitId: number): Promise<{ bytes: Buffer; type: string }> {
  await getNodeInOrg(orgId, nodeId);
  const row = await db()('field_visits').where({ id: visitId, org_id: orgId, node_id: nodeId }).first('photo_path');
  const name = row?.photo_path as string | null | undefined;
  // The stored name is ours (hex + extension); anything else is never opened.
  if (!name || !/^[0-9a-f]{32}\.(png|jpg)$/.test(name)) throw problems.notFound('The photo');
  const bytes = await readFile(path.join(photoRoot(), name)).catch(() => { throw problems.notFound('The photo'); });
  const type = sniffImageType(bytes.subarray(0, 16));
  if (!type) throw problems.notFound('The photo');
  return { bytes, type };
}
