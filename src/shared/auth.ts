import { z } from 'zod';
import { displayName, email, password } from './fields';
import type { ProjectRole } from './roles';

export const loginBody = z.strictObject({
  email,
  password: z.string().min(1, 'Enter your password.').max(200),
});
export type LoginBody = z.infer<typeof loginBody>;

export const forgotBody = z.strictObject({ email });
export type ForgotBody = z.infer<typeof forgotBody>;

/** Used both for first-use invitations and password resets. */
export const resetBody = z.strictObject({
  token: z.string().min(20).max(200),
  password,
});
export type ResetBody = z.infer<typeof resetBody>;

export const changePasswordBody = z.strictObject({
  currentPassword: z.string().min(1, 'Enter your current password.').max(200),
  newPassword: password,
});
export type ChangePasswordBody = z.infer<typeof changePasswordBody>;

export const updateMeBody = z.strictObject({ displayName });
export type UpdateMeBody = z.infer<typeof updateMeBody>;

export interface MembershipSummary {
  projectId: number;
  projectName: string;
  role: ProjectRole;
}

export interface Me {
  id: number;
  email: string;
  displayName: string;
  isAdmin: boolean;
  /** Site-wide: may this account create projects (admins and supervisors of any project). */
  canCreateProjects: boolean;
  projects: MembershipSummary[];
}

export interface CsrfResponse {
  token: string;
}

export interface LoginResponse {
  user: Me;
  /** The session id changes at sign-in, so the old CSRF token is void; use this one. */
  csrfToken: string;
}
