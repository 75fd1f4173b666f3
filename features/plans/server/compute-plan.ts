import 'server-only';
import { planTorque, TorquePlanError, type TorquePlan, type Wrench } from '@/features/torque-plan';
import { DomainError } from '@/server/errors';
import type { TorquePlanRequest } from '../schemas';

/**
 * Resolves the wrenches and runs the engine; the engine's refusals become field errors.
 * Tool-crib ids are resolved through `findShopWrenches`, scoped to the member's shop. A request
 * without its own `minFractionOfMax` is planned with the shop's wrench floor (`shopFloor`, a fraction).
 */
export async function computePlan(
  request: TorquePlanRequest,
  findShopWrenches: (ids: string[]) => Promise<Wrench[]>,
  shopFloor: number,
): Promise<TorquePlan> {
  const ids = request.wrenchIds ?? [];
  const fromCrib = ids.length ? await findShopWrenches(ids) : [];
  const missing = ids.filter((id) => !fromCrib.some((w) => w.id === id));
  if (missing.length) {
    const message = `Not an in-service wrench of this shop's tool crib: ${missing.join(', ')}.`;
    throw new DomainError('invalid', message, { wrenchIds: [message] });
  }
  try {
    return planTorque({
      ...request,
      minFractionOfMax: request.minFractionOfMax ?? shopFloor,
      wrenches: [...fromCrib, ...(request.wrenches ?? [])],
    });
  } catch (error) {
    if (error instanceof TorquePlanError) {
      throw new DomainError('invalid', error.message, { [error.field ?? 'body']: [error.message] });
    }
    throw error;
  }
}
