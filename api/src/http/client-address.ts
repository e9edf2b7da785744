import type { Request } from 'express';
import { ipKeyGenerator } from 'express-rate-limit';

/**
 * The client's address as the throttle counts it: `req.ip` after the proxies the app trusts
 * (`trust proxy`), with an IPv6 address reduced to its /56 network, since one client usually
 * holds a whole IPv6 prefix (express-rate-limit's `ipKeyGenerator`).
 */
export function clientAddress(req: Request): string {
  return ipKeyGenerator(req.ip ?? req.socket.remoteAddress ?? 'unknown');
}
