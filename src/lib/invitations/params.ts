// A token path parameter, or a 404 that names nothing.
import { ApiError } from '@/lib/http/api';
import { looksLikeToken } from './tokens';

export function tokenParam(value: string | undefined, what = 'This link'): string {
  if (!looksLikeToken(value)) throw new ApiError(404, 'not_found', `${what} is not valid. Check that the whole link was copied from the e-mail.`);
  return value;
}
