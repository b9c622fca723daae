import { problemResponse } from '@/lib/errors';
import { ingest } from '@/lib/ingest/ingest';

// The device ingest contract (DESIGN.md §5); documented in the README and /api/v1/openapi.json.
export async function POST(request: Request): Promise<Response> {
  try {
    return await ingest(request);
  } catch (error) {
    return problemResponse(error);
  }
}
