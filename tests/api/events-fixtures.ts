// Shared set-up for the calendar engine's API tests (events, runways, markets, occasions).
import type { Agent } from '../helpers/test-app';

/** A small runway: 2 build days, 1 build day with 2 cure days after, then the launch. */
export const smallSteps = [
  { name: 'Cut', kind: 'build', workDays: 2, hoursPerDay: 4, cureDays: 0 },
  { name: 'Paint', kind: 'build', workDays: 1, hoursPerDay: 4, cureDays: 2 },
  { name: 'Launch', kind: 'launch', workDays: 0, hoursPerDay: 0, cureDays: 0 },
] as const;

/** Plans and stores a runway; fails the test with the body when the API refuses it. */
export async function storeRunway(agent: Agent, studioId: number, body: Record<string, unknown>) {
  const response = await agent.post(`/api/studios/${studioId}/runways`).send(body);
  if (response.status !== 201) throw new Error(`POST /runways: ${response.status} ${JSON.stringify(response.body)}`);
  return response.body as {
    id: number;
    launch: string;
    steps: { id: string; name: string; start: string | null; end: string | null; version: number }[];
  };
}

export async function eventsOf(agent: Agent, studioId: number, from: string, to: string) {
  const response = await agent.get(`/api/studios/${studioId}/events?from=${from}&to=${to}`);
  if (response.status !== 200) throw new Error(`GET /events: ${response.status} ${JSON.stringify(response.body)}`);
  return response.body as { id: string; kind: string; title: string; start: string; end: string; version?: number; [key: string]: unknown }[];
}
