import { db } from '@/lib/db/knex';
import { signedIn } from './session';

/** Throwaway nodes for tests, made through the real API as the demo deployer. */
export async function deployer() {
  return signedIn('deployer@larkspur.example');
}

let counter = 0;

export async function createTestNode(prefix = 'test-node', overrides: Record<string, unknown> = {}) {
  const s = await deployer();
  const template = await db()('nodes as n').join('organizations as o', 'o.id', 'n.org_id').where('o.slug', 'larkspur-hollow').whereNull('n.deleted_at').orderBy('n.id').first('n.id');
  const wire = (await s.agent.get(`/api/v1/nodes/${template.id}`)).body;
  const { id: _id, site_name: _site, ...rest } = wire;
  // No calibration unless asked, whatever the template's: a test reads back the volts it posted.
  const body = { ...rest, calibration: { gain: 1, offset_volts: 0 }, ...overrides };
  const name = `${prefix}-${process.pid}-${Date.now()}-${counter++}`;
  const res = await s.agent.post('/api/v1/nodes').set('origin', s.origin).send({ ...body, name });
  if (res.status !== 201) throw new Error(`node create failed: ${res.status} ${JSON.stringify(res.body)}`);
  const nodeId = res.body.id as number;
  const cred = await s.agent.post(`/api/v1/nodes/${nodeId}/credentials`).set('origin', s.origin).send({ label: 'test' });
  if (cred.status !== 201) throw new Error(`credential create failed: ${cred.status}`);
  return { nodeId, token: cred.body.token as string, credentialId: cred.body.id as number, session: s, body: { ...body, name } };
}
