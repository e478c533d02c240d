import { useOutletContext } from 'react-router';
import type { Me } from '../../shared/auth';

/** The signed-in person, for routes inside the shell (which renders only once it is known). */
export function useCurrentUser(): Me {
  return useOutletContext<{ me: Me }>().me;
}
