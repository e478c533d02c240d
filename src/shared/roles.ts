// Project roles and site-wide flags, shared by client and server.
// The permission rule table lives in src/shared/permissions.ts; the client
// asks that same table (never role names) to decide what to show.

export const PROJECT_ROLES = ['supervisor', 'modeller', 'student'] as const;
export type ProjectRole = (typeof PROJECT_ROLES)[number];

export const ROLE_LABELS: Record<ProjectRole, string> = {
  supervisor: 'Supervisor',
  modeller: 'Modeller',
  student: 'Student',
};
