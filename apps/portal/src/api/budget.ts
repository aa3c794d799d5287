import type { BudgetAnswer, BudgetLine, BudgetLineInput } from '@swardwise/domain';
import { api } from './client.ts';

const scope = (season: number, districtId: number | null) => ({ season, ...(districtId === null ? {} : { districtId }) });

export function getBudget(season: number, districtId: number | null, signal?: AbortSignal): Promise<BudgetAnswer> {
  return api.get<BudgetAnswer>('/budget', scope(season, districtId), signal);
}

export function updateBudgetLine(input: BudgetLineInput): Promise<{ line: { line: BudgetLine; budget: number | null; version: number | null } }> {
  return api.patch('/budget/line', input);
}

const query = (season: number, districtId: number | null) => new URLSearchParams(Object.entries(scope(season, districtId)).map(([k, v]) => [k, String(v)])).toString();
export const budgetCsvUrl = (season: number, districtId: number | null) => `/api/budget/export.csv?${query(season, districtId)}`;
export const budgetPdfUrl = (season: number, districtId: number | null) => `/api/budget/report.pdf?${query(season, districtId)}`;
