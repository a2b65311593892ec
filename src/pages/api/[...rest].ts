import { errorResponse, notFound } from '@/lib/server/http';

/** Any API path we do not serve answers JSON 404, not an HTML page. */
export const ALL = () => errorResponse(notFound('That API route'));
