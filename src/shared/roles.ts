// Project roles and site-wide flags, shared by client and server.
// The permission matrix itself lives in server/auth/permissions.ts; the client
// only uses these names to decide what to hide.

export const PROJECT_ROLES = ['supervisor', 'modeller', 'student'] as const;
export type ProjectRole = (typeof PROJECT_ROLES)[number];

export const ROLE_LABELS: Record<ProjectRole, string> = {
  supervisor: 'Supervisor',
  modeller: 'Modeller',
  student: 'Student',
};
