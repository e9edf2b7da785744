import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { ErrorBody } from '../../../shared/errors';

/**
 * Counts failed sign-ins per client address and e-mail; successful ones do not count.
 * Ten failures in fifteen minutes lock that pair out with 429 (OWASP Authentication Cheat Sheet:
 * throttle repeated failures; the numbers are our choice).
 */
export function loginRateLimit(maxFailures = 10, windowMs = 15 * 60 * 1000) {
  const body: ErrorBody = {
    error: {
      code: 'too_many_requests',
      message: 'Too many failed sign-in attempts. Wait a few minutes and try again.',
    },
  };
  return rateLimit({
    windowMs,
    limit: maxFailures,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => {
      const email = typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : '';
      return `${ipKeyGenerator(req.ip ?? '')}|${email}`;
    },
    handler: (_req, res) => {
      res.status(429).json(body);
    },
  });
}
