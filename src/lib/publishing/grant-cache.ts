// Share grants resolved from cookies, remembered for two seconds; revoking a link clears this process's memory
// at once, and other processes forget within the two seconds.
import { TtlCache } from '@/lib/http/ttl-cache';

export const shareGrants = new TtlCache<App.Locals['shareGrant']>(2000);
