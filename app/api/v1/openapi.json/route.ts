import { getEnv } from '@/lib/env';
import { buildOpenApiDocument } from '@/lib/openapi/document';

export const dynamic = 'force-dynamic';

export function GET() {
  return Response.json(buildOpenApiDocument(getEnv().APP_URL));
}
