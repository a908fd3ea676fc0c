// The window plan of one order, computed now from its facts, the engine and the plant settings.

import type { WindowPlanDto } from '@shared/schemas/work-order-plan';
import { compute, loadFacts } from './order-facts';

export async function getWindowPlan(orderId: string): Promise<WindowPlanDto> {
  return compute(await loadFacts(orderId)).windowPlan;
}
