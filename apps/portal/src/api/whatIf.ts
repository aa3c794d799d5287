import type { WhatIfAnswer, WhatIfInput } from '@swardwise/domain';
import { api } from './client.ts';

/** The season's change if the fields moved and the Standards changed; nothing is saved. */
export function previewWhatIf(input: WhatIfInput): Promise<WhatIfAnswer> {
  return api.post<WhatIfAnswer>('/what-if', input);
}
