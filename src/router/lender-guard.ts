/** Sends a farm's lender from the members' screens to what is shared with them: a lender lands on the shared scenarios only. */
import type { NavigationGuard } from 'vue-router';
import { useSessionStore } from '@/stores/session';

export const lenderToSharedView: NavigationGuard = async (to) => {
  const session = useSessionStore();
  await session.ensureLoaded();
  const farmId = Number(to.params.farmId);
  const role = session.session?.memberships.find((m) => m.farmId === farmId)?.role;
  if (role !== 'lender') return true;
  const scenarioId = to.params.scenarioId;
  return { name: 'lender-home', params: { farmId, ...(typeof scenarioId === 'string' ? { scenarioId } : {}) } };
};
