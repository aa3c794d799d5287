/** Who a page or a menu entry is for, in the groups the portal names them by. */
import type { Role } from '@swardwise/domain';

/** The department's office: the administrator, the head and the district foremen. */
export const OFFICE: readonly Role[] = ['admin', 'head', 'foreman'];
/** The office and the crews: pages about the fields themselves. */
export const FIELD_STAFF: readonly Role[] = [...OFFICE, 'crew'];
