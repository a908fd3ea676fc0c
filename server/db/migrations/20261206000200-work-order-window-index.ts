import type { QueryInterface } from 'sequelize';

export const name = '20261206000200-work-order-window-index';

// Overlapping windows are found through this index (ranges that meet, &&), so checking one order
// reads the orders booked near its window, not every order the plant ever booked.
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    create index work_orders_window_range_idx on work_orders using gist (tstzrange(window_start, window_end))
      where state <> 'cancelled' and window_start is not null`);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('drop index if exists work_orders_window_range_idx');
}
