import type { FieldStatus } from '@swardwise/domain';

export interface StatusNotice {
  type: 'error' | 'warning' | 'info';
  title: string;
}

/** The alert a field page or booking form shows for a field that is not open; null when it is open. */
export function statusNotice(status: FieldStatus, context: 'field' | 'booking'): StatusNotice | null {
  switch (status) {
    case 'open':
      return null;
    case 'restricted':
      return { type: 'warning', title: 'Play on this field is restricted.' };
    case 'closed':
      return { type: 'error', title: context === 'booking' ? 'This field is closed to play; check with the foreman before booking it.' : 'This field is closed to play.' };
    case 'retired':
      return context === 'booking'
        ? { type: 'error', title: 'This field is retired and no longer kept; book another field.' }
        : { type: 'info', title: 'This field is retired: it is no longer kept and the week plan leaves it out. Its records stay.' };
  }
}
