/** The department's costs and rates as `GET /api/costs` answers them. */
import type { CostSettings } from '../schemas/costs.ts';

export interface CostSettingsAnswer {
  costs: CostSettings;
  /** `setting` once the department has entered its own; `default` while the starting values apply. */
  source: 'setting' | 'default';
  version: number;
}
