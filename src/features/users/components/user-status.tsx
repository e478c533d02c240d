import type { UserSummary } from '../../../shared/users';
import { Badge } from '../../../components/ui/badge';

export function UserStatus({ user }: { user: UserSummary }) {
  if (user.disabled) return <Badge tone="alert">Disabled</Badge>;
  if (!user.activated) return <Badge tone="paper">Invited</Badge>;
  return <Badge tone="ok">Active</Badge>;
}
