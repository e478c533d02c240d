import { z } from 'zod';
import { displayName, email, NAME_MAX } from './fields';
import { PROJECT_ROLES, type ProjectRole } from './roles';

export const projectRole = z.enum(PROJECT_ROLES, 'Choose supervisor, modeller or student.');

export const createProjectBody = z.strictObject({
  name: z.string().trim().min(1, 'Enter a project name.').max(NAME_MAX, `A name has at most ${NAME_MAX} characters.`),
  description: z.string().trim().max(5000, 'A description has at most 5000 characters.').optional(),
});
export type CreateProjectBody = z.infer<typeof createProjectBody>;

export const updateProjectBody = createProjectBody.partial().refine((b) => Object.keys(b).length > 0, 'Change at least one field.');
export type UpdateProjectBody = z.infer<typeof updateProjectBody>;

/** Add a member by e-mail; an unknown address gets a new account and an invitation. */
export const addMemberBody = z.strictObject({
  email,
  role: projectRole,
  displayName: displayName.optional(),
});
export type AddMemberBody = z.infer<typeof addMemberBody>;

export const changeRoleBody = z.strictObject({ role: projectRole });
export type ChangeRoleBody = z.infer<typeof changeRoleBody>;

export interface ProjectSummary {
  id: number;
  name: string;
  description: string;
  /** The caller's role; null for an admin who is not a member. */
  role: ProjectRole | null;
  memberCount: number;
  moleculeCount: number;
  createdAt: string;
}

export interface Member {
  userId: number;
  email: string;
  displayName: string;
  role: ProjectRole;
  activated: boolean;
}
