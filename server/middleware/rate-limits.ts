import { rateLimit } from 'express-rate-limit';

/** Sign-in, sign-up and password-reset routes: slows guessing without bothering real users. */
export function authRateLimit(limit: number) {
  return rateLimit({
    windowMs: 15 * 60 * 1000,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({
        error: {
          code: 'rate_limited',
          message: 'Too many attempts. Try again in a few minutes.',
        },
      });
    },
  });
}
