import type { ProjectRole } from '../../../shared/roles';
import { ROLE_LABELS } from '../../../shared/roles';
import { Badge } from '../../../components/ui/badge';

export function RoleBadge({ role }: { role: ProjectRole | null }) {
  if (!role) return <Badge tone="paper">Admin view</Badge>;
  return <Badge tone={role === 'supervisor' ? 'ink' : 'paper'}>{ROLE_LABELS[role]}</Badge>;
}
