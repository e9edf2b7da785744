import { z } from 'zod';
import { ZRole } from './auth';
import { safeText } from './safe-text';

export const ZUser = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: ZRole,
  active: z.boolean(),
  createdAt: z.string(),
});
export type TUser = z.infer<typeof ZUser>;

export const ZCreateUserRequest = z.strictObject({
  email: safeText().trim().toLowerCase().email('Enter a valid e-mail address'),
  name: safeText().trim().min(1, 'Enter a name').max(120),
  role: ZRole,
  password: safeText().min(12, 'Use at least 12 characters').max(200),
});
export type TCreateUserRequest = z.infer<typeof ZCreateUserRequest>;

export const ZUpdateUserRequest = z
  .strictObject({
    name: safeText().trim().min(1).max(120).optional(),
    role: ZRole.optional(),
    active: z.boolean().optional(),
  })
  .refine((body) => Object.keys(body).length > 0, { message: 'Change at least one field' });
export type TUpdateUserRequest = z.infer<typeof ZUpdateUserRequest>;

export const ZUserList = z.object({ items: z.array(ZUser) });
export type TUserList = z.infer<typeof ZUserList>;
