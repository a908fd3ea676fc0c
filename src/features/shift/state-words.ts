import { WORK_ORDER_STATE_LABELS, type WorkOrderState } from '@shared/schemas/work-orders';

/** An order's state in words; the DTOs carry it as a string. */
export const orderStateWords = (state: string) => WORK_ORDER_STATE_LABELS[state as WorkOrderState] ?? state;
