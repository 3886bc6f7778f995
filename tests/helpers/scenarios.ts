/** Helpers for the scenario API tests: signed-in agents and the demo farm's scenarios. */
import { readFileSync } from 'node:fs';
import request from 'supertest';
import { expect } from 'vitest';
import { scenarioSchema, type Scenario } from '../../shared/schema/index.js';
import type { TestApp } from './app.js';

export const DEMO_PASSWORD = 'byrecast-demo';

/** A supertest agent holding the session cookie of `email`. */
export async function signedIn(t: TestApp, email: string, password = DEMO_PASSWORD): Promise<request.Agent> {
  const agent = request.agent(t.app);
  const res = await agent.post('/api/auth/sign-in').send({ email, password });
  expect(res.status).toBe(200);
  return agent;
}

/** The id of the caller's farm with this name. */
export async function farmIdByName(agent: request.Agent, name: string): Promise<number> {
  const res = await agent.get('/api/farms');
  expect(res.status).toBe(200);
  const farm = (res.body as { id: number; name: string }[]).find((f) => f.name === name);
  if (!farm) throw new Error(`no farm named ${name}`);
  return farm.id;
}

/** A demo scenario file from scenarios/, validated as the CLI validates it. */
export function demoScenarioFile(fileName: string): Scenario {
  const raw: unknown = JSON.parse(readFileSync(new URL(`../../scenarios/${fileName}`, import.meta.url), 'utf8'));
  return scenarioSchema.parse(raw);
}

/** Round-trips a value through JSON, as it reaches the client. */
export function asJson<T>(value: T): unknown {
  return JSON.parse(JSON.stringify(value));
}
