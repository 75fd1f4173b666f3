import { createRouteHandler } from 'uploadthing/next';
import { photoRouter } from '@/features/runner/server/photo-router';

// The SDK's own handler: its middleware authenticates and authorises each upload (session, role,
// the wheel's shop and assignee); its callback is verified by the service's signature.
export const { GET, POST } = createRouteHandler({ router: photoRouter });
