import { errorResponse } from '@/server/http/handler';
import { DomainError } from '@/server/errors';

// An /api/ address that names no handler gets the API's JSON 404, not Next's HTML 404 page:
// proxy.ts skips /api/, so that HTML would go out without its CSP nonce and HSTS.
const unknownAddress = () =>
  errorResponse(new DomainError('not_found', 'There is no such API address.'));

export const GET = unknownAddress;
export const POST = unknownAddress;
export const PUT = unknownAddress;
export const PATCH = unknownAddress;
export const DELETE = unknownAddress;
