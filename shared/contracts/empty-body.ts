import { z } from 'zod';

/**
 * Body of a write that takes no input (sign out, submit findings, verify a fix, ...): none or
 * `{}`. Anything else is refused with the unknown field named, as for every other request body.
 */
export const ZEmptyBody = z.strictObject({});

/** Parses a body that must be empty; a missing body counts as `{}`. */
export const parseEmptyBody = (body: unknown) => ZEmptyBody.parse(body ?? {});
