import { useOutletContext } from 'react-router';
import type { AuthUser } from '@baytime/shared';
import type { OfficeRole } from '@/config/office-nav';

export interface OfficeContext {
  user: AuthUser;
  role: OfficeRole;
}

/** The signed-in office user, for pages inside the shell. */
export function useOffice(): OfficeContext {
  return useOutletContext<OfficeContext>();
}
