import type { NextRequest } from 'next/server';
import { createRouteHandler } from 'uploadthing/next';
import { photoRouter } from '@/features/runner/server/photo-router';
import { assertSameOrigin, errorResponse } from '@/server/http/handler';
import { DomainError } from '@/server/errors';

// The SDK's own handler: its middleware authenticates and authorises each upload (session, role,
// the wheel's shop and assignee); its callback is verified by the service's signature.
const handler = createRouteHandler({ router: photoRouter });

export const GET = handler.GET;

/**
 * A browser's upload request must come from this app's pages, like every other write. The upload
 * service's own callback carries no browser Origin: it is told apart by its hook header, and the
 * SDK accepts it only with a valid signature made with the app's key.
 */
export async function POST(request: NextRequest) {
  const hook = request.headers.get('uploadthing-hook');
  if (hook !== 'callback' && hook !== 'error') {
    try {
      assertSameOrigin(request);
    } catch (error) {
      if (error instanceof DomainError) return errorResponse(error);
      throw error;
    }
  }
  return handler.POST(request);
}
