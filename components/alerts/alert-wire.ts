import type { AlertKind, AlertStatus } from '@/lib/alerts/kinds';
import type { AlertDetail } from '@/lib/alerts/rules';
import type { NodeState } from '@/lib/config/node-states';

/** GET /api/v1/alerts as JSON: the alert, its node and site, the figures it was written with, its e-mails. */
export interface AlertMailWire {
  pending: number;
  sent: number;
  dead: number;
  /** Pending, but held back by the organization's hourly cap until `held_until`. */
  held: number;
  held_until: string | null;
  last_error: string | null;
}

export interface AlertWire {
  id: number;
  node_id: number;
  node_name: string;
  node_state: NodeState;
  site_id: number;
  site_name: string;
  time_zone: string;
  kind: AlertKind;
  status: AlertStatus;
  /** The node's figures at the last pass that refreshed the alert (null fields: not known). */
  detail: Partial<AlertDetail> | null;
  opened_at: string;
  updated_at: string;
  last_notified_at: string | null;
  acknowledged_at: string | null;
  acknowledged_by_name: string | null;
  resolved_at: string | null;
  mail: AlertMailWire;
}

/** GET /api/v1/alerts/outbox (owners): e-mails without their bodies. */
export interface OutboxWire {
  id: number;
  alert_id: number | null;
  purpose: 'alert' | 'digest' | 'invitation' | 'password_reset';
  to_address: string;
  subject: string;
  status: 'pending' | 'sent' | 'dead';
  attempts: number;
  next_attempt_at: string;
  last_error: string | null;
  created_at: string;
  sent_at: string | null;
  held: boolean;
}
