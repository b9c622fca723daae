import { z } from 'zod';
import { bankSchema, converterSchema, loadSchema } from './model';

/** A node's settings as the API and the settings form send them. */
export const nodeBody = z.object({
  name: z.string().trim().min(1, 'Give the node a name.').max(120).regex(/^[^\r\n\t]*$/, 'Use one line.'),
  site_id: z.number().int().positive('Choose a site.'),
  purpose: z.string().trim().max(200).regex(/^[^\r\n]*$/, 'Use one line.').default(''),
  bank: bankSchema,
  converter: converterSchema,
  load: loadSchema,
  calibration: z.object({
    gain: z.number().finite().min(0.5).max(2).default(1),
    offset_volts: z.number().finite().min(-1).max(1).default(0),
  }).strict().default({ gain: 1, offset_volts: 0 }),
  panel_watts: z.number().finite().min(0).max(1000).nullable().default(null),
}).strict();

export type NodeBody = z.infer<typeof nodeBody>;
