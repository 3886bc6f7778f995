/**
 * Where a sign-in without a `next` page lands: a lender on their newest share, a farmer (owner or
 * partner) with exactly one farm on that farm, everyone else (a consultant, several farms, none)
 * on the farm list (docs/design.md, Flow: "a farmer goes straight to their own farm").
 */
import type { RouteLocationRaw } from 'vue-router';
import { useSessionStore } from '@/stores/session';
import { useSharedScenarioStore } from '@/stores/shared-scenario';

export async function landingAfterSignIn(): Promise<RouteLocationRaw> {
  const memberships = useSessionStore().session?.memberships ?? [];
  const lenderOn = memberships.filter((m) => m.role === 'lender').map((m) => m.farmId);
  if (memberships.length > 0 && lenderOn.length === memberships.length) {
    const newest = await useSharedScenarioStore().newestShare(lenderOn);
    if (newest) return { name: 'lender-home', params: { farmId: newest.farmId, scenarioId: newest.scenarioId } };
    const [first] = lenderOn;
    return first === undefined ? { name: 'farms' } : { name: 'lender-home', params: { farmId: first } };
  }
  const [only] = memberships;
  if (memberships.length === 1 && only && (only.role === 'owner' || only.role === 'partner')) return { name: 'farm-home', params: { farmId: only.farmId } };
  return { name: 'farms' };
}
