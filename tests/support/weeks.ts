/** Week plan steps several API test files take before what they check, written once. */
import type supertest from 'supertest';

/**
 * Generates the week of `weekStart` for a district as the signed-in `agent` (a foreman) and
 * confirms its suggested crews; answers the confirmation's response.
 */
export async function generateAndConfirmWeek(agent: ReturnType<typeof supertest.agent>, districtId: number, weekStart: string) {
  await agent.post('/api/week-plans/generate').send({ districtId, weekStart });
  return agent.post('/api/week-plans/confirm').send({ districtId, weekStart });
}
