import { z } from 'zod';
import { displayName, email } from './fields';

export const createUserBody = z.strictObject({
  email,
  displayName,
  isAdmin: z.boolean().optional(),
});
export type CreateUserBody = z.infer<typeof createUserBody>;

export const updateUserBody = z
  .strictObject({
    displayName: displayName.optional(),
    isAdmin: z.boolean().optional(),
    disabled: z.boolean().optional(),
  })
  .refine((b) => Object.keys(b).length > 0, 'Change at least one field.');
export type UpdateUserBody = z.infer<typeof updateUserBody>;

export interface UserSummary {
  id: number;
  email: string;
  displayName: string;
  isAdmin: boolean;
  disabled: boolean;
  /** False until the person has set a password from their invitation. */
  activated: boolean;
  createdAt: string;
}
